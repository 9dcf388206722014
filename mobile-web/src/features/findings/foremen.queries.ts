import type { Foreman } from '@plummet/shared';
import { useLiveQuery } from 'dexie-react-hooks';
import { db, readMeta } from '../../local-db/db';
import { FOREMEN_META_KEY } from '../../sync/download-foremen';

/** The organisation's foremen as last downloaded (empty before the first sync with a connection). */
export function useForemen(): Foreman[] | undefined {
  return useLiveQuery(async () => (await readMeta<Foreman[]>(db, FOREMEN_META_KEY)) ?? [], []);
}

/** One foreman by id, when the phone knows them. */
export function useForeman(id: string | null | undefined): Foreman | undefined {
  return useForemen()?.find((foreman) => foreman.id === id);
}
