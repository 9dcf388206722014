/**
 * Keeps the organisation's settings on the phone (due times, proof photos, who may verify, shift
 * end), so the fix loop applies the organisation's own rules with no signal. Refreshed after each
 * sync that reached the server; a failure keeps the last copy.
 */
import { OrganisationSettingsSchema } from '@plummet/shared';
import { writeMeta, type PlummetDb } from '../local-db/db';
import type { FetchLike } from './sync-transport';

/** Meta key of the organisation's settings (features read it; the defaults apply before the first copy). */
export const ORGANISATION_SETTINGS_META_KEY = 'organisationSettings';

export async function downloadOrganisationSettings(database: PlummetDb, fetchImpl: FetchLike): Promise<boolean> {
  try {
    const response = await fetchImpl('/api/organisation/settings', { headers: { Accept: 'application/json' } });
    if (!response.ok) return false;
    const settings = OrganisationSettingsSchema.parse(await response.json());
    await writeMeta(database, ORGANISATION_SETTINGS_META_KEY, settings);
    return true;
  } catch {
    return false;
  }
}
