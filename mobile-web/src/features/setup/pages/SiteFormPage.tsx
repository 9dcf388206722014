import { INSPECTION_REGIMES, JURISDICTIONS, type Site } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { useEffect, useMemo, useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { ManagerLayout } from '../../manager/components/ManagerLayout';
import { describedBy, Field } from '../components/Field';
import { errorFor, fieldErrorsOfError, type FieldErrors } from '../form-errors';
import { createSite, updateSite } from '../setup.api';
import { useRefreshSetup, useSite } from '../setup.queries';
import { JURISDICTION_WORDS, newSiteForm, readSiteChange, readSiteForm, REGIME_WORDS, siteFormOf, type SiteForm } from '../site-form';
import '../setup.css';

const browserTimeZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone || 'Europe/London';
const knownTimeZones = (): string[] => {
  const intl = Intl as unknown as { supportedValuesOf?: (key: string) => string[] };
  return intl.supportedValuesOf?.('timeZone') ?? [];
};

/** Add a site, or change one: its address, client, regime, rules and time zone. */
export function SiteFormPage() {
  const { siteId } = useParams();
  const existing = useSite(siteId);
  const site = existing.data;
  return (
    <ManagerLayout title={siteId ? 'Change the site' : 'Add a site'} testId="site-form-page">
      <p>
        <Link to="/setup/sites">← Sites and scaffolds</Link>
      </p>
      {siteId && !site ? (
        <p>{existing.isError ? 'The site could not be loaded. Check the connection and try again.' : 'Loading the site…'}</p>
      ) : (
        <SiteFormBody key={site?.id ?? 'new'} site={site} />
      )}
    </ManagerLayout>
  );
}

function SiteFormBody({ site }: { site?: Site }) {
  const navigate = useNavigate();
  const refresh = useRefreshSetup();
  const [form, setForm] = useState<SiteForm>(() => (site ? siteFormOf(site) : newSiteForm(browserTimeZone())));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [saved, setSaved] = useState(false);
  const zones = useMemo(knownTimeZones, []);
  const save = useMutation({
    mutationFn: (body: Record<string, unknown>) => (site ? updateSite(site.id, body) : createSite(body as never)),
    onSuccess: async () => {
      await refresh();
      if (site) setSaved(true);
      else navigate('/setup/sites');
    },
    onError: (error) => setErrors(fieldErrorsOfError(error)),
  });
  useEffect(() => setSaved(false), [form]);

  const set = <K extends keyof SiteForm>(key: K, value: SiteForm[K]) => setForm((f) => ({ ...f, [key]: value }));
  const text = (key: keyof SiteForm, label: string, hint?: string, type = 'text') => (
    <Field id={`site-${key}`} label={label} hint={hint} error={errorFor(errors, key)}>
      <input {...describedBy(`site-${key}`, errorFor(errors, key))} type={type} value={form[key]} onChange={(e) => set(key, e.target.value as never)} />
    </Field>
  );

  function submit(event: FormEvent) {
    event.preventDefault();
    const checked = site ? readSiteChange(form, site) : readSiteForm(form);
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    save.mutate(checked.body);
  }

  return (
    <form className="setup-form" onSubmit={submit} noValidate data-testid="site-form">
      <fieldset>
        <legend>The site</legend>
        {text('name', 'Name', 'As the team calls it, e.g. Quayside Library')}
        {text('address', 'Address')}
        <div className="setup-row">
          <Field id="site-timeZone" label="Time zone" hint="Due times and report dates use it" error={errorFor(errors, 'timeZone')}>
            <input {...describedBy('site-timeZone', errorFor(errors, 'timeZone'))} list="time-zones" value={form.timeZone} onChange={(e) => set('timeZone', e.target.value)} />
            <datalist id="time-zones">
              {zones.map((zone) => (
                <option key={zone} value={zone} />
              ))}
            </datalist>
          </Field>
        </div>
      </fieldset>
      <fieldset>
        <legend>Whom the inspections are for</legend>
        {text('clientName', 'Client name')}
        {text('clientAddress', 'Client address', 'Goes on every report')}
        {text('clientContactEmail', 'Client contact e-mail', 'Optional: gets a copy of each report when the organisation sends client copies', 'email')}
      </fieldset>
      <fieldset>
        <legend>Rules</legend>
        <Field id="site-regime" label="Inspections due" error={errorFor(errors, 'regime')}>
          <select {...describedBy('site-regime', errorFor(errors, 'regime'))} value={form.regime} onChange={(e) => set('regime', e.target.value as SiteForm['regime'])}>
            {INSPECTION_REGIMES.map((r) => (
              <option key={r} value={r}>
                {REGIME_WORDS[r]}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id="site-jurisdiction"
          label="Rules the site works under"
          hint="Picks the regulations named beside each check and their pass criteria"
          error={errorFor(errors, 'jurisdiction')}
        >
          <select {...describedBy('site-jurisdiction', errorFor(errors, 'jurisdiction'))} value={form.jurisdiction} onChange={(e) => set('jurisdiction', e.target.value as SiteForm['jurisdiction'])}>
            {JURISDICTIONS.map((j) => (
              <option key={j} value={j}>
                {JURISDICTION_WORDS[j]}
              </option>
            ))}
          </select>
        </Field>
      </fieldset>
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
        <button type="submit" className="manager-button" disabled={save.isPending} data-testid="save-site">
          {save.isPending ? 'Saving…' : site ? 'Save the changes' : 'Add the site'}
        </button>
      </div>
    </form>
  );
}
