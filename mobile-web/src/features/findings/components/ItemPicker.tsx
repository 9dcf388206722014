import { IonInput } from '@ionic/react';
import { SHAPE_DIMENSIONS, SHAPE_KINDS, ORIENTATIONS, type Orientation } from '@plummet/shared';
import { useMemo, useState } from 'react';
import { ChoiceGroup } from '../../../components/ChoiceGroup';
import { NumberField } from '../../../components/NumberField';
import type { CatalogueItemRecord } from '../../../local-db/records';
import { searchCatalogue } from '../../catalogue/catalogue-search';
import { formatQuantity, unitLabel, type Units } from '../../../lib/units';
import type { FindingForm, FormReading, ItemMode, ShapeChoice } from '../finding-form';
import { describeShape, DIMENSION_WORDS, ORIENTATION_WORDS, SHAPE_WORDS } from '../finding-words';
import './ItemPicker.css';

interface ItemPickerProps {
  form: FindingForm;
  onChange(patch: Partial<FindingForm>): void;
  catalogue: readonly CatalogueItemRecord[];
  units: Units;
  problems: FormReading['problems'];
  showProblems: boolean;
}

const SHAPE_CHOICES: ShapeChoice[] = [...SHAPE_KINDS, 'unknown'];

/** The item: found in the catalogue as the inspector types, or described (mass, shape, size). */
export function ItemPicker({ form, onChange, catalogue, units, problems, showProblems }: ItemPickerProps) {
  const [query, setQuery] = useState('');
  const hits = useMemo(() => searchCatalogue(catalogue, query), [catalogue, query]);
  const chosen = catalogue.find((item) => item.id === form.catalogueItemId);
  const sizeUnit = unitLabel('size', units);

  return (
    <div className="item-picker">
      <ChoiceGroup<ItemMode>
        legend="The item"
        value={form.itemMode}
        onChange={(itemMode) => onChange({ itemMode })}
        choices={[
          { value: 'catalogue', label: 'From the catalogue' },
          { value: 'custom', label: 'Describe it' },
        ]}
        testId="item-mode"
      />
      {form.itemMode === 'catalogue' ? (
        <>
          {chosen && (
            <div className="item-picker__chosen" data-testid="chosen-item">
              <strong>{chosen.name}</strong>
              <span>
                {formatQuantity('mass', chosen.massKg, units)} · {describeShape(chosen.shape, units)}
              </span>
              <span className="item-picker__source">Source: {chosen.source}</span>
            </div>
          )}
          <IonInput
            label={chosen ? 'Search for another item' : 'Search the catalogue'}
            labelPlacement="stacked"
            fill="outline"
            type="search"
            placeholder="e.g. coupler, hammer, brick"
            value={query}
            onIonInput={(event) => setQuery(String(event.detail.value ?? ''))}
            data-testid="item-search"
          />
          {query.trim() !== '' && (
            <ul className="item-picker__hits" data-testid="item-hits">
              {hits.length === 0 && <li className="muted item-picker__none">Nothing matches. Try another word, or describe the item.</li>}
              {hits.map((item) => (
                <li key={item.id}>
                  <button
                    type="button"
                    className="item-picker__hit"
                    onClick={() => {
                      onChange({ catalogueItemId: item.id });
                      setQuery('');
                    }}
                    data-testid="item-hit"
                  >
                    <span className="item-picker__hit-name">{item.name}</span>
                    <span className="item-picker__hit-mass">{formatQuantity('mass', item.massKg, units)}</span>
                  </button>
                </li>
              ))}
            </ul>
          )}
          {showProblems && problems.item && <p className="field-error item-picker__problem">{problems.item}</p>}
        </>
      ) : (
        <>
          <IonInput
            label="What is it?"
            labelPlacement="stacked"
            fill="outline"
            value={form.customName}
            placeholder="e.g. offcut of scaffold board"
            onIonInput={(event) => onChange({ customName: String(event.detail.value ?? '') })}
            data-testid="custom-name"
          />
          {showProblems && problems.name && <p className="field-error">{problems.name}</p>}
          <div className="item-picker__gap" />
          <NumberField label="Mass" unit={unitLabel('mass', units)} value={form.massText} onChange={(massText) => onChange({ massText })} error={showProblems || form.massText ? problems.mass : undefined} testId="custom-mass" />
          <ChoiceGroup<ShapeChoice>
            legend="Shape"
            value={form.shape}
            onChange={(shape) => onChange({ shape })}
            choices={SHAPE_CHOICES.map((value) => ({ value, label: SHAPE_WORDS[value] }))}
            testId="custom-shape"
          />
          {form.shape !== 'unknown' && (
            <>
              <div className="field-row">
                {SHAPE_DIMENSIONS[form.shape].map((field) => (
                  <NumberField
                    key={field}
                    label={DIMENSION_WORDS[field] ?? field}
                    unit={sizeUnit}
                    value={form.dimensionTexts[field] ?? ''}
                    onChange={(text) => onChange({ dimensionTexts: { ...form.dimensionTexts, [field]: text } })}
                    testId={`dimension-${field}`}
                  />
                ))}
              </div>
              {(showProblems || Object.values(form.dimensionTexts).some((text) => text !== '')) && problems.dimensions && (
                <p className="field-error">{problems.dimensions}</p>
              )}
              <ChoiceGroup<Orientation>
                legend="How it would fall"
                layout="stack"
                value={form.orientation}
                onChange={(orientation) => onChange({ orientation })}
                choices={ORIENTATIONS.map((value) => ({ value, ...ORIENTATION_WORDS[value] }))}
                testId="custom-orientation"
              />
            </>
          )}
          {form.shape === 'unknown' && <p className="muted">Without a shape the estimate ignores air drag: the fastest possible fall.</p>}
        </>
      )}
    </div>
  );
}
