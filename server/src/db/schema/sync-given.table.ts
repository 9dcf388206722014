import { integer, pgTable, primaryKey, uuid } from 'drizzle-orm/pg-core';
import { syncClients } from './sync.table.js';

/**
 * The highest version of each record the server has handed a phone (in a pull page or a push
 * answer). A pushed base version is never taken above it: a phone cannot claim to have seen a
 * version it was never given, so a high number cannot hide a conflict.
 */
export const syncClientVersions = pgTable(
  'sync_client_versions',
  {
    clientId: uuid('client_id').notNull().references(() => syncClients.id, { onDelete: 'cascade' }),
    recordId: uuid('record_id').notNull(),
    version: integer('version').notNull(),
  },
  (t) => [primaryKey({ columns: [t.clientId, t.recordId] })],
);
