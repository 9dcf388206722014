/**
 * The organisation's settings on this phone, apart from fix-loop.queries.ts: reading them builds
 * shared's settings schema, which the inspector's home (its to-verify count) does not need.
 */
import { DEFAULT_ORGANISATION_SETTINGS, readOrganisationSettings, type OrganisationSettings } from '@plummet/shared';
import { useLiveQuery } from 'dexie-react-hooks';
import { useMemo } from 'react';
import { db, readMeta } from '../../local-db/db';
import { ORGANISATION_SETTINGS_META_KEY } from '../../sync/download-settings';

/** The organisation's settings as last synced, or the defaults (common practice, no source) before then. */
export function useOrganisationSettings(): OrganisationSettings {
  const stored = useLiveQuery(() => readMeta<unknown>(db, ORGANISATION_SETTINGS_META_KEY), []);
  // One object per stored value: the fix lists re-query when it changes, not on every render.
  return useMemo(() => (stored === undefined ? DEFAULT_ORGANISATION_SETTINGS : readOrganisationSettings(stored)), [stored]);
}
