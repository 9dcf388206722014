/**
 * Built-in catalogue items are upserted in the migration step (server/src/db/migrate.ts), under the
 * same advisory lock, every time the server or the seed starts: the list in
 * shared/src/catalogue/builtin-items.ts is the truth, and a changed figure reaches every database
 * without a new migration. Fixed ids make it idempotent. Items removed from the list stay, since
 * findings may name them.
 */
import { BUILTIN_ITEMS } from '@plummet/shared';
import { sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { catalogueItems } from '../db/schema/index.js';

/** Takes a database or a transaction (the seed runs it inside its own). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function upsertBuiltinCatalogue(db: PgDatabase<PgQueryResultHKT, any, any>): Promise<number> {
  const rows = BUILTIN_ITEMS.map((item) => ({ ...item, organisationId: null }));
  await db
    .insert(catalogueItems)
    .values(rows)
    .onConflictDoUpdate({
      target: catalogueItems.id,
      set: {
        name: sql`excluded.name`,
        category: sql`excluded.category`,
        massKg: sql`excluded.mass_kg`,
        shape: sql`excluded.shape`,
        source: sql`excluded.source`,
        // Only a real change bumps the version, so restarts leave the rows untouched.
        version: sql`case when (${catalogueItems.name}, ${catalogueItems.category}, ${catalogueItems.massKg}, ${catalogueItems.shape}, ${catalogueItems.source})
          is distinct from (excluded.name, excluded.category, excluded.mass_kg, excluded.shape, excluded.source)
          then ${catalogueItems.version} + 1 else ${catalogueItems.version} end`,
        updatedAt: sql`case when (${catalogueItems.name}, ${catalogueItems.category}, ${catalogueItems.massKg}, ${catalogueItems.shape}, ${catalogueItems.source})
          is distinct from (excluded.name, excluded.category, excluded.mass_kg, excluded.shape, excluded.source)
          then now() else ${catalogueItems.updatedAt} end`,
      },
    });
  return rows.length;
}
