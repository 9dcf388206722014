import { useIonAlert } from '@ionic/react';
import { INSPECTION_REGIMES, LOAD_CLASS_WORDS, LOAD_CLASSES, type Scaffold, type Site } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useEffect, useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useUnits, useWindUnits } from '../../auth/session.queries';
import { ExclusionZoneSection } from '../../register/components/ExclusionZoneSection';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { ScaffoldStatusTag } from '../../scaffolds/components/ScaffoldStatusTag';
import { ScaffoldPreviewPanel } from '../components/ScaffoldPreviewPanel';
import { describedBy, Field } from '../components/Field';
import { errorFor, fieldErrorsOfError, type FieldErrors } from '../form-errors';
import { newScaffoldForm, readScaffoldChange, readScaffoldForm, resizeLiftHeights, scaffoldFormOf, type ScaffoldForm } from '../scaffold-form';
import { archiveScaffold, createScaffold, updateScaffold } from '../setup.api';
import { useForemen, useRefreshSetup, useScaffoldToEdit, useSite } from '../setup.queries';
import { REGIME_WORDS } from '../site-form';
import { unitLabel } from '../../../lib/units';
import '../setup.css';
import { formatDateTime, formatDay } from '../../../lib/format-date';

/** Add a scaffold to a site, or change one; the drawing follows the form as it is typed. */
export function ScaffoldFormPage() {
  const params = useParams();
  const existing = useScaffoldToEdit(params.scaffoldId);
  const siteId = params.siteId ?? existing.data?.siteId;
  const site = useSite(siteId);
  const ready = site.data && (!params.scaffoldId || existing.data);
  const failed = site.isError || existing.isError;
  const units = useUnits();
  const windUnits = useWindUnits();
  return (
    <ManagerLayout title={params.scaffoldId ? 'Change the scaffold' : 'Add a scaffold'} testId="scaffold-form-page">
      <p>
        <Link to="/setup/sites">← Sites and scaffolds</Link>
      </p>
      {ready ? (
        <>
          <ScaffoldEditor key={existing.data?.id ?? 'new'} site={site.data!} scaffold={existing.data} />
          {existing.data && <ExclusionZoneSection scaffoldId={existing.data.id} units={units} windUnits={windUnits} canEdit />}
        </>
      ) : (
        <p>{failed ? 'The scaffold could not be loaded. Check the connection and try again.' : 'Loading…'}</p>
      )}
    </ManagerLayout>
  );
}

function ScaffoldEditor({ site, scaffold }: { site: Site; scaffold?: Scaffold }) {
  const units = useUnits();
  const navigate = useNavigate();
  const refresh = useRefreshSetup();
  const foremen = useForemen();
  const [presentAlert] = useIonAlert();
  const [form, setForm] = useState<ScaffoldForm>(() => (scaffold ? scaffoldFormOf(scaffold, units) : newScaffoldForm(units)));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  useEffect(() => setSaved(false), [form]);

  const save = useMutation({
    mutationFn: async (body: Record<string, unknown>) => (scaffold ? updateScaffold(scaffold.id, body) : createScaffold(body as never)),
    onSuccess: async (result) => {
      await refresh();
      if (scaffold) setSaved(true);
      else navigate(`/setup/scaffolds/${result.id}`, { replace: true });
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });
  const archive = useMutation({
    mutationFn: () => archiveScaffold(scaffold!.id),
    onSuccess: async () => {
      await refresh();
      navigate('/setup/sites');
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });

  const set = <K extends keyof ScaffoldForm>(key: K, value: ScaffoldForm[K]) => setForm((f) => ({ ...f, [key]: value }));
  const err = (path: string) => errorFor(errors, path);
  const height = unitLabel('height', units);

  function submit(event: FormEvent) {
    event.preventDefault();
    const checked = scaffold ? readScaffoldChange(form, scaffold, units) : readScaffoldForm(form, site.id, units);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    save.mutate(checked.body as Record<string, unknown>);
  }

  function confirmArchive() {
    void presentAlert({
      header: `Archive ${scaffold!.reference}?`,
      message: 'Do this when the scaffold is struck or gone from the site. Its inspections and findings are kept; it leaves the phones at their next sync.',
      buttons: [
        { text: 'Keep it', role: 'cancel' },
        { text: 'Archive', role: 'destructive', handler: () => archive.mutate() },
      ],
    });
  }

  const liftHeights = resizeLiftHeights(form);
  return (
    <div className="setup-editor">
      <form className="setup-form" onSubmit={submit} noValidate data-testid="scaffold-form">
        <p className="setup-muted">
          On <strong>{site.name}</strong>
          {scaffold && (
            <>
              {' '}
              · <ScaffoldStatusTag status={scaffold.status} recorded={scaffold.lastInspectedAt ? `last inspected ${formatDateTime(scaffold.lastInspectedAt)}` : null} />
            </>
          )}
        </p>
        {scaffold?.archivedAt && <p className="setup-form__error">Archived on {formatDay(scaffold.archivedAt)}: it is no longer on the phones.</p>}
        <fieldset>
          <legend>The scaffold</legend>
          <Field id="scaffold-reference" label="Reference" hint="As on its tag, e.g. QL-A" error={err('reference')}>
            <input {...describedBy('scaffold-reference', err('reference'))} value={form.reference} onChange={(e) => set('reference', e.target.value)} />
          </Field>
          <Field id="scaffold-description" label="Description" error={err('description')}>
            <textarea {...describedBy('scaffold-description', err('description'))} rows={2} value={form.description} onChange={(e) => set('description', e.target.value)} />
          </Field>
          <Field id="scaffold-elevations" label="Elevations" hint="Its faces, separated by commas, e.g. North, East" error={err('elevations')}>
            <input {...describedBy('scaffold-elevations', err('elevations'))} value={form.elevations} onChange={(e) => set('elevations', e.target.value)} />
          </Field>
          <div className="setup-row">
            <Field id="scaffold-lifts" label="Lifts" error={err('lifts')}>
              <input {...describedBy('scaffold-lifts', err('lifts'))} inputMode="numeric" value={form.lifts} onChange={(e) => set('lifts', e.target.value)} />
            </Field>
            <Field id="scaffold-bays" label="Bays on each elevation" error={err('baysPerElevation')}>
              <input {...describedBy('scaffold-bays', err('baysPerElevation'))} inputMode="numeric" value={form.baysPerElevation} onChange={(e) => set('baysPerElevation', e.target.value)} />
            </Field>
            <Field id="scaffold-lift-height" label={`Usual lift height (${height})`} hint="Often 2 m: common practice, no source" error={err('liftHeightM')}>
              <input {...describedBy('scaffold-lift-height', err('liftHeightM'))} inputMode="decimal" value={form.liftHeight} onChange={(e) => set('liftHeight', e.target.value)} />
            </Field>
          </div>
          <label className="setup-check">
            <input type="checkbox" checked={form.liftsDiffer} onChange={(e) => setForm((f) => ({ ...f, liftsDiffer: e.target.checked, liftHeights: resizeLiftHeights(f) }))} data-testid="lifts-differ" />
            Lifts differ in height
          </label>
          {form.liftsDiffer && (
            <div className="setup-heights" role="group" aria-label={`Height of each lift (${height}), from the bottom`}>
              {liftHeights.map((value, i) => (
                <Field key={i} id={`scaffold-lift-${i + 1}`} label={`Lift ${i + 1}`} error={errors[`liftHeightsM.${i}`]}>
                  <input
                    {...describedBy(`scaffold-lift-${i + 1}`, errors[`liftHeightsM.${i}`])}
                    inputMode="decimal"
                    value={value}
                    onChange={(e) => setForm((f) => ({ ...f, liftHeights: resizeLiftHeights(f).map((h, j) => (j === i ? e.target.value : h)) }))}
                  />
                </Field>
              ))}
              {errors.liftHeightsM && (
                <p className="setup-field__error" role="alert">
                  {errors.liftHeightsM}
                </p>
              )}
            </div>
          )}
        </fieldset>
        <fieldset>
          <legend>Who and when</legend>
          <Field id="scaffold-foreman" label="Foreman who looks after it" error={err('foremanId')}>
            <select {...describedBy('scaffold-foreman', err('foremanId'))} value={form.foremanId} onChange={(e) => set('foremanId', e.target.value)}>
              <option value="">Nobody named yet</option>
              {foremen.data?.map((f) => (
                <option key={f.id} value={f.id}>
                  {f.name}
                  {f.position ? ` (${f.position})` : ''}
                </option>
              ))}
            </select>
          </Field>
          <Field id="scaffold-regime" label="Inspections due" error={err('regime')}>
            <select {...describedBy('scaffold-regime', err('regime'))} value={form.regime} onChange={(e) => set('regime', e.target.value as ScaffoldForm['regime'])}>
              <option value="">As the site: {REGIME_WORDS[site.regime]}</option>
              {INSPECTION_REGIMES.map((r) => (
                <option key={r} value={r}>
                  {REGIME_WORDS[r]}
                </option>
              ))}
            </select>
          </Field>
        </fieldset>
        <fieldset>
          <legend>Handover</legend>
          <Field id="scaffold-load-class" label="Load class" error={err('loadClass')}>
            <select {...describedBy('scaffold-load-class', err('loadClass'))} value={form.loadClass} onChange={(e) => set('loadClass', e.target.value as ScaffoldForm['loadClass'])}>
              <option value="">Not recorded</option>
              {LOAD_CLASSES.map((c) => (
                <option key={c} value={c}>
                  {LOAD_CLASS_WORDS[c]}
                </option>
              ))}
            </select>
          </Field>
          <Field id="scaffold-design" label="Design reference" hint="The drawing or design it was erected to" error={err('designReference')}>
            <input {...describedBy('scaffold-design', err('designReference'))} value={form.designReference} onChange={(e) => set('designReference', e.target.value)} />
          </Field>
          <div className="setup-row">
            <Field id="scaffold-contractor" label="Erected by" error={err('erectingContractor')}>
              <input {...describedBy('scaffold-contractor', err('erectingContractor'))} value={form.erectingContractor} onChange={(e) => set('erectingContractor', e.target.value)} />
            </Field>
            <Field id="scaffold-handed-over" label="Handed over on" error={err('handedOverOn')}>
              <input {...describedBy('scaffold-handed-over', err('handedOverOn'))} type="date" value={form.handedOverOn} onChange={(e) => set('handedOverOn', e.target.value)} />
            </Field>
          </div>
        </fieldset>
        {!scaffold && <p className="setup-muted">A new scaffold is recorded as closed to use until its first inspection records a status.</p>}
        {errors[''] && (
          <p className="setup-form__error" role="alert">
            {errors['']}
          </p>
        )}
        {saved && (
          <p className="setup-form__saved" role="status">
            Saved.
          </p>
        )}
        <div className="manager-actions">
          <button type="submit" className="manager-button" disabled={save.isPending} data-testid="save-scaffold">
            {save.isPending ? 'Saving…' : scaffold ? 'Save the changes' : 'Add the scaffold'}
          </button>
          {scaffold && !scaffold.archivedAt && (
            <button type="button" className="manager-button manager-button--plain" onClick={confirmArchive} disabled={archive.isPending} data-testid="archive-scaffold">
              Archive…
            </button>
          )}
        </div>
      </form>
      <ScaffoldPreviewPanel form={form} units={units} />
    </div>
  );
}
