import { sql } from 'drizzle-orm';
import { bigint, customType, integer, timestamp } from 'drizzle-orm/pg-core';

export const createdAt = () => timestamp('created_at', { withTimezone: true }).notNull().defaultNow();
export const updatedAt = () => timestamp('updated_at', { withTimezone: true }).notNull().defaultNow();
/** Optimistic version: bumped on every write; sync compares it per field. */
export const version = () => integer('version').notNull().default(1);

/** PostgreSQL's 64-bit transaction id (never wraps), read and written as a decimal string. */
export const xid8 = customType<{ data: string; driverData: string }>({ dataType: () => 'xid8' });

/**
 * The change-feed stamp of a synced row: the writing transaction's id and a sequence value, set on
 * insert by the column defaults and on every Drizzle update by `$onUpdate`, so every writer (REST or
 * sync) stamps without knowing about sync. GET /api/sync/pull orders by (xid, seq); see
 * server/src/sync/sync-pull.repository.ts for why that never skips a row that commits late.
 * (Here rather than in sync.table.ts so every table file can use it without an import cycle.)
 */
export const syncStampColumns = () => ({
  syncXid: xid8('sync_xid')
    .notNull()
    .default(sql`pg_current_xact_id()`)
    .$onUpdate(() => sql`pg_current_xact_id()`),
  syncSeq: bigint('sync_seq', { mode: 'number' })
    .notNull()
    .default(sql`nextval('sync_change_seq')`)
    .$onUpdate(() => sql`nextval('sync_change_seq')`),
});
