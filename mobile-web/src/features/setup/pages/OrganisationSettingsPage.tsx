import { UNITS_VALUES, type OrganisationSettings } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useEffect, useState, type FormEvent } from 'react';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { describedBy, Field } from '../components/Field';
import { SeverityTableEditor } from '../components/SeverityTableEditor';
import { errorFor, fieldErrorsOfError, type FieldErrors } from '../form-errors';
import { updateOrganisationSettings } from '../setup.api';
import { useOrganisationSettings, useRefreshSetup } from '../setup.queries';
import { defaultSeverityRows, readSettingsForm, settingsFormOf, type SettingsForm } from '../settings-form';
import '../setup.css';

const UNIT_WORDS: Record<OrganisationSettings['defaultUnits'], string> = { si: 'Metres and kilograms', imperial: 'Feet and pounds' };

/** The organisation's rules: fix due times, proof and verification, the digest, client copies, photos, units, severity bands. */
export function OrganisationSettingsPage() {
  const settings = useOrganisationSettings();
  return (
    <ManagerLayout title="Organisation" testId="organisation-settings-page">
      {settings.data ? (
        <SettingsFormBody settings={settings.data} />
      ) : (
        <p>{settings.isError ? 'The settings could not be loaded. Check the connection and try again.' : 'Loading the settings…'}</p>
      )}
    </ManagerLayout>
  );
}

function SettingsFormBody({ settings }: { settings: OrganisationSettings }) {
  const refresh = useRefreshSetup();
  const [form, setForm] = useState<SettingsForm>(() => settingsFormOf(settings));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  useEffect(() => setSaved(false), [form]);
  const save = useMutation({
    mutationFn: updateOrganisationSettings,
    onSuccess: async (next) => {
      setForm(settingsFormOf(next));
      await refresh();
      setSaved(true);
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });
  const set = <K extends keyof SettingsForm>(key: K, value: SettingsForm[K]) => setForm((f) => ({ ...f, [key]: value }));
  const err = (path: string) => errorFor(errors, path);
  const input = (key: 'fixDueHigh' | 'fixDueMedium' | 'shiftEndsAt' | 'timeZone' | 'digestHour', path: string, label: string, hint?: string) => (
    <Field id={`settings-${key}`} label={label} hint={hint} error={err(path)}>
      <input {...describedBy(`settings-${key}`, err(path))} value={form[key]} onChange={(e) => set(key, e.target.value)} />
    </Field>
  );
  const check = (key: 'proofPhotoRequiredForHigh' | 'verifierMustDifferFromFixer' | 'clientCopyOfReports' | 'keepPhotoLocation', label: string) => (
    <label className="setup-check">
      <input type="checkbox" checked={form[key]} onChange={(e) => set(key, e.target.checked)} data-testid={`settings-${key}`} />
      {label}
    </label>
  );

  function submit(event: FormEvent) {
    event.preventDefault();
    const checked = readSettingsForm(form);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    save.mutate(checked.body);
  }

  return (
    <form className="setup-form setup-form--wide" onSubmit={submit} noValidate data-testid="settings-form">
      <fieldset>
        <legend>Fixing findings</legend>
        <div className="setup-row">
          {input('fixDueHigh', 'fixDueHours.High', 'High: fix within (hours)', 'Common practice, no source: 24')}
          {input('fixDueMedium', 'fixDueHours.Medium', 'Medium: fix within (hours)', 'Common practice, no source: 72')}
          {input('shiftEndsAt', 'shiftEndsAt', 'Shift ends at', 'A made-safe measure lapses then unless renewed')}
        </div>
        <p className="setup-muted">Low findings are due before the scaffold’s next inspection.</p>
        {check('proofPhotoRequiredForHigh', 'A High finding needs a proof photo to be made safe or fixed')}
        {check('verifierMustDifferFromFixer', 'Whoever fixed a finding cannot verify it')}
      </fieldset>
      <fieldset>
        <legend>Mail and reports</legend>
        <div className="setup-row">
          {input('digestHour', 'digestHour', 'Daily digest at (hour, 0–23)')}
          {input('timeZone', 'timeZone', 'Time zone', 'For shift ends, the digest and dates in mail, e.g. Europe/London')}
        </div>
        {check('clientCopyOfReports', 'Send each site’s client contact a copy of every report')}
      </fieldset>
      <fieldset>
        <legend>Photos and units</legend>
        {check('keepPhotoLocation', 'Keep where each photo was taken (removed by default)')}
        <Field id="settings-defaultUnits" label="Units new members start with" error={err('defaultUnits')}>
          <select {...describedBy('settings-defaultUnits', err('defaultUnits'))} value={form.defaultUnits} onChange={(e) => set('defaultUnits', e.target.value as SettingsForm['defaultUnits'])}>
            {UNITS_VALUES.map((u) => (
              <option key={u} value={u}>
                {UNIT_WORDS[u]}
              </option>
            ))}
          </select>
        </Field>
      </fieldset>
      <fieldset>
        <legend>Severity bands</legend>
        <p className="setup-muted">
          {form.severity === null
            ? 'Estimates use Plummet’s default bands (an organisation may set its own).'
            : 'Estimates use your own bands: each level starts at the energy or peak force given, with its source.'}
        </p>
        <div className="manager-actions">
          {form.severity === null ? (
            <button type="button" className="manager-button manager-button--plain" onClick={() => set('severity', defaultSeverityRows())} data-testid="own-bands">
              Set our own bands, starting from the defaults
            </button>
          ) : (
            <button type="button" className="manager-button manager-button--plain" onClick={() => set('severity', null)}>
              Go back to Plummet’s default bands
            </button>
          )}
        </div>
        {form.severity && <SeverityTableEditor rows={form.severity} errors={errors} onChange={(rows) => set('severity', rows)} />}
        {errors.severityTable && <p className="setup-field__error">{errors.severityTable}</p>}
      </fieldset>
      {errors[''] && (
        <p className="setup-form__error" role="alert">
          {errors['']}
        </p>
      )}
      {saved && (
        <p className="setup-form__saved" role="status">
          Saved. Phones take the new settings at their next sync.
        </p>
      )}
      <div className="manager-actions">
        <button type="submit" className="manager-button" disabled={save.isPending} data-testid="save-settings">
          {save.isPending ? 'Saving…' : 'Save the settings'}
        </button>
      </div>
    </form>
  );
}
