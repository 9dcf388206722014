import { queryOptions } from '@tanstack/react-query';
import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { SiteRecord } from '../../local-db/records';
import { fetchSites } from './sites.api';

export const siteKeys = {
  all: ['sites'] as const,
  list: () => [...siteKeys.all, 'list'] as const,
};

/** The organisation's sites from the server (online only; the phone's copies are in Dexie). */
export function sitesQueryOptions() {
  return queryOptions({ queryKey: siteKeys.list(), queryFn: ({ signal }) => fetchSites(signal), networkMode: 'online' });
}

/** Sites kept on this phone, by name (undefined while loading). */
export function useLocalSites(): SiteRecord[] | undefined {
  return useLiveQuery(() => db.sites.toArray().then((sites) => sites.sort((a, b) => a.name.localeCompare(b.name))), []);
}

/** One site from the phone: undefined while loading, null when it is not here. */
export function useLocalSite(siteId: string | undefined): SiteRecord | null | undefined {
  return useLiveQuery(async () => (siteId ? ((await db.sites.get(siteId)) ?? null) : null), [siteId]);
}
