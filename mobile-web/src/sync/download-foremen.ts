/**
 * Keeps the organisation's foremen on the phone, so an inspector can hand a finding to one while
 * offline. Refreshed after each sync that reached the server; a failure keeps the last list.
 */
import { ForemanListResponseSchema, type Role } from '@plummet/shared';
import { writeMeta, type PlummetDb } from '../local-db/db';
import type { FetchLike } from './sync-transport';

/** Meta key of the foremen list (features/fix-loop reads it). */
export const FOREMEN_META_KEY = 'foremen';

/** Roles that hand findings to foremen. */
const ASSIGNING_ROLES: readonly Role[] = ['inspector', 'manager', 'admin'];

export async function downloadForemen(database: PlummetDb, fetchImpl: FetchLike, role: Role): Promise<boolean> {
  if (!ASSIGNING_ROLES.includes(role)) return false;
  try {
    const response = await fetchImpl('/api/users/foremen', { headers: { Accept: 'application/json' } });
    if (!response.ok) return false;
    const { items } = ForemanListResponseSchema.parse(await response.json());
    await writeMeta(database, FOREMEN_META_KEY, items);
    return true;
  } catch {
    return false;
  }
}
