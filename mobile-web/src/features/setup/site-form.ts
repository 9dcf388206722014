/** The site form's state and the request body it makes, checked with the shared schema. */
import { SiteCreateSchema, SiteUpdateSchema, type InspectionRegime, type Jurisdiction, type Site, type SiteCreate } from '@plummet/shared';
import { fieldErrorsOf, type FieldErrors } from './form-errors';

export interface SiteForm {
  name: string;
  address: string;
  clientName: string;
  clientAddress: string;
  clientContactEmail: string;
  regime: InspectionRegime;
  jurisdiction: Jurisdiction;
  timeZone: string;
}

export function newSiteForm(timeZone: string): SiteForm {
  return { name: '', address: '', clientName: '', clientAddress: '', clientContactEmail: '', regime: '7-day', jurisdiction: 'uk', timeZone };
}

export function siteFormOf(site: Site): SiteForm {
  return {
    name: site.name,
    address: site.address,
    clientName: site.clientName,
    clientAddress: site.clientAddress,
    clientContactEmail: site.clientContactEmail ?? '',
    regime: site.regime,
    jurisdiction: site.jurisdiction,
    timeZone: site.timeZone,
  };
}

function bodyOf(form: SiteForm) {
  const email = form.clientContactEmail.trim();
  return { ...form, clientContactEmail: email === '' ? null : email };
}

export type SiteFormResult = { ok: true; body: SiteCreate } | { ok: false; errors: FieldErrors };

/** A new site's body, or the message of each field the shared schema refuses. */
export function readSiteForm(form: SiteForm): SiteFormResult {
  const parsed = SiteCreateSchema.safeParse(bodyOf(form));
  return parsed.success ? { ok: true, body: parsed.data } : { ok: false, errors: fieldErrorsOf(parsed.error.issues) };
}

/** The change to an existing site (only what differs), checked the same way. */
export function readSiteChange(form: SiteForm, site: Site): { ok: true; body: Record<string, unknown> } | { ok: false; errors: FieldErrors } {
  const checked = readSiteForm(form);
  if (!checked.ok) return checked;
  const before = bodyOf(siteFormOf(site)) as Record<string, unknown>;
  const changes: Record<string, unknown> = { version: site.version };
  for (const [key, value] of Object.entries(bodyOf(form))) if (value !== before[key]) changes[key] = value;
  const parsed = SiteUpdateSchema.safeParse(changes);
  return parsed.success ? { ok: true, body: parsed.data } : { ok: false, errors: { '': 'Nothing has changed' } };
}

export const REGIME_WORDS: Record<InspectionRegime, string> = {
  '7-day': 'Every 7 days (UK WAHR 2005 reg. 12)',
  'pre-shift': 'Before each shift (US OSHA 29 CFR 1926.451(f)(3))',
};

export const JURISDICTION_WORDS: Record<Jurisdiction, string> = {
  uk: 'United Kingdom (Work at Height Regulations 2005)',
  us: 'United States (OSHA 29 CFR 1926 Subpart L)',
};
