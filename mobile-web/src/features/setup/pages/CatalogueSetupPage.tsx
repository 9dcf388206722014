import { useIonAlert } from '@ionic/react';
import {
  CATALOGUE_CATEGORIES,
  SHAPE_DIMENSIONS,
  SHAPE_KINDS,
  type CatalogueCategory,
  type CatalogueItem,
  type CatalogueItemCreate,
  type ShapeKind,
} from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { formatQuantity, unitLabel, type Units } from '../../../lib/units';
import { useUnits } from '../../auth/session.queries';
import { describeShape, DIMENSION_WORDS, SHAPE_WORDS } from '../../findings/finding-words';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { describedBy, Field } from '../components/Field';
import { catalogueFormOf, newCatalogueForm, readCatalogueForm, type CatalogueForm } from '../catalogue-form';
import { errorFor, fieldErrorsOfError, type FieldErrors } from '../form-errors';
import { createCatalogueItem, deleteCatalogueItem, updateCatalogueItem } from '../setup.api';
import { useCatalogueItems, useRefreshSetup } from '../setup.queries';
import '../setup.css';

const CATEGORY_WORDS: Record<CatalogueCategory, string> = {
  'hand-tool': 'Hand tool',
  fitting: 'Fitting',
  board: 'Board',
  tube: 'Tube',
  material: 'Material',
  debris: 'Debris',
  other: 'Other',
};

/** The organisation's own items beside Plummet's built-in ones; inspectors pick from both. */
export function CatalogueSetupPage() {
  const items = useCatalogueItems();
  const units = useUnits();
  const refresh = useRefreshSetup();
  const [presentAlert] = useIonAlert();
  const [editing, setEditing] = useState<CatalogueItem | null>(null);
  const remove = useMutation({ mutationFn: deleteCatalogueItem, onSuccess: refresh });
  const own = items.data?.filter((i) => !i.builtIn) ?? [];
  const builtIn = items.data?.filter((i) => i.builtIn) ?? [];
  const confirmRemove = (item: CatalogueItem) =>
    void presentAlert({
      header: `Remove ${item.name}?`,
      message: 'Findings already recorded with it keep their mass and size.',
      buttons: [{ text: 'Keep it', role: 'cancel' }, { text: 'Remove', role: 'destructive', handler: () => remove.mutate(item.id) }],
    });
  return (
    <ManagerLayout title="Item catalogue" testId="catalogue-setup-page">
      <section className="manager-section">
        <h2>{editing ? `Change ${editing.name}` : 'Add an item of your own'}</h2>
        <CatalogueItemForm key={editing?.id ?? 'new'} units={units} item={editing ?? undefined} onDone={() => setEditing(null)} />
      </section>
      <section className="manager-section">
        <h2>Your items</h2>
        {own.length === 0 ? <p className="setup-muted">None yet.</p> : <ItemTable items={own} units={units} onRemove={confirmRemove} onChange={setEditing} />}
      </section>
      <section className="manager-section">
        <h2>Built into Plummet</h2>
        {items.isPending ? <p>Loading…</p> : <ItemTable items={builtIn} units={units} />}
      </section>
    </ManagerLayout>
  );
}

interface ItemTableProps {
  items: CatalogueItem[];
  units: Units;
  onRemove?(item: CatalogueItem): void;
  onChange?(item: CatalogueItem): void;
}

function ItemTable({ items, units, onRemove, onChange }: ItemTableProps) {
  return (
    <div className="manager-table-wrap">
      <table className="manager-table">
        <thead>
          <tr>
            <th scope="col">Item</th>
            <th scope="col">Kind</th>
            <th scope="col">Mass</th>
            <th scope="col">Shape</th>
            <th scope="col">Source</th>
            {onRemove && (
              <th scope="col">
                <span className="visually-hidden">Remove</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.id}>
              <td>{item.name}</td>
              <td>{CATEGORY_WORDS[item.category]}</td>
              <td>{formatQuantity('mass', item.massKg, units)}</td>
              <td>{describeShape(item.shape, units)}</td>
              <td className="setup-muted">{item.source}</td>
              {onRemove && (
                <td>
                  <div className="setup-card__actions">
                    {onChange && (
                      <button type="button" className="manager-button manager-button--plain" onClick={() => onChange(item)}>
                        Change
                      </button>
                    )}
                    <button type="button" className="manager-button manager-button--plain" onClick={() => onRemove(item)}>
                      Remove…
                    </button>
                  </div>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function CatalogueItemForm({ units, item, onDone }: { units: Units; item?: CatalogueItem; onDone(): void }) {
  const refresh = useRefreshSetup();
  const [form, setForm] = useState<CatalogueForm>(() => (item ? catalogueFormOf(item, units) : newCatalogueForm()));
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useMutation({
    mutationFn: (body: CatalogueItemCreate) => (item ? updateCatalogueItem(item.id, { ...body, version: item.version }) : createCatalogueItem(body)),
    onSuccess: async () => {
      setForm(newCatalogueForm());
      await refresh();
      onDone();
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });
  const err = (path: string) => errorFor(errors, path);
  function submit(event: FormEvent) {
    event.preventDefault();
    const checked = readCatalogueForm(form, units);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    create.mutate(checked.body);
  }
  return (
    <form className="setup-form" onSubmit={submit} noValidate data-testid="catalogue-form">
      <div className="setup-row">
        <Field id="item-name" label="Name" error={err('name')}>
          <input {...describedBy('item-name', err('name'))} value={form.name} onChange={(e) => setForm({ ...form, name: e.target.value })} />
        </Field>
        <Field id="item-category" label="Kind" error={err('category')}>
          <select {...describedBy('item-category', err('category'))} value={form.category} onChange={(e) => setForm({ ...form, category: e.target.value as CatalogueCategory })}>
            {CATALOGUE_CATEGORIES.map((c) => (
              <option key={c} value={c}>
                {CATEGORY_WORDS[c]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="item-mass" label={`Mass (${unitLabel('mass', units)})`} error={err('massKg')}>
          <input {...describedBy('item-mass', err('massKg'))} inputMode="decimal" value={form.mass} onChange={(e) => setForm({ ...form, mass: e.target.value })} />
        </Field>
      </div>
      <div className="setup-row">
        <Field id="item-shape" label="Shape" error={err('shape.kind')}>
          <select {...describedBy('item-shape', err('shape.kind'))} value={form.kind} onChange={(e) => setForm({ ...form, kind: e.target.value as ShapeKind })}>
            {SHAPE_KINDS.map((k) => (
              <option key={k} value={k}>
                {SHAPE_WORDS[k]}
              </option>
            ))}
          </select>
        </Field>
        {SHAPE_DIMENSIONS[form.kind].map((field) => (
          <Field key={field} id={`item-${field}`} label={`${DIMENSION_WORDS[field]} (${unitLabel('size', units)})`} error={errors[`shape.${field}`]}>
            <input
              {...describedBy(`item-${field}`, errors[`shape.${field}`])}
              inputMode="decimal"
              value={form.sizes[field] ?? ''}
              onChange={(e) => setForm({ ...form, sizes: { ...form.sizes, [field]: e.target.value } })}
            />
          </Field>
        ))}
      </div>
      <Field id="item-source" label="Where the mass and size come from" hint="A maker's data sheet, a weighing on site…" error={err('source')}>
        <input {...describedBy('item-source', err('source'))} value={form.source} onChange={(e) => setForm({ ...form, source: e.target.value })} />
      </Field>
      {errors[''] && (
        <p className="setup-form__error" role="alert">
          {errors['']}
        </p>
      )}
      <div className="manager-actions">
        <button type="submit" className="manager-button" disabled={create.isPending} data-testid="save-item">
          {create.isPending ? 'Saving…' : item ? 'Save the changes' : 'Add the item'}
        </button>
        {item && (
          <button type="button" className="manager-button manager-button--plain" onClick={onDone}>
            Cancel
          </button>
        )}
      </div>
    </form>
  );
}
