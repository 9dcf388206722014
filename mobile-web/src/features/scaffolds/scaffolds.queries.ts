import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { ScaffoldRecord } from '../../local-db/records';

export function useScaffoldsOfSite(siteId: string | undefined): ScaffoldRecord[] | undefined {
  return useLiveQuery(
    async () => (siteId ? (await db.scaffolds.where('siteId').equals(siteId).toArray()).sort((a, b) => a.reference.localeCompare(b.reference)) : []),
    [siteId],
  );
}

/** One scaffold from the phone: undefined while loading, null when it is not here. */
export function useScaffold(scaffoldId: string | undefined): ScaffoldRecord | null | undefined {
  return useLiveQuery(async () => (scaffoldId ? ((await db.scaffolds.get(scaffoldId)) ?? null) : null), [scaffoldId]);
}
