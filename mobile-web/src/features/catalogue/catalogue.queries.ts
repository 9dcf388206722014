import { useLiveQuery } from 'dexie-react-hooks';
import { db } from '../../local-db/db';
import type { CatalogueItemRecord } from '../../local-db/records';

/** The item catalogue on the phone (a few dozen items: searched in memory as the inspector types). */
export function useCatalogue(): CatalogueItemRecord[] | undefined {
  return useLiveQuery(() => db.catalogue.toArray(), []);
}
