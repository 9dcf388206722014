/**
 * Sync: the change feed's stamps, each phone's mutation counter, the outcome of every
 * mutation it sent, and the conflicts kept when a later write replaced a value its writer had not seen.
 */
import { sql } from 'drizzle-orm';
import { bigint, bigserial, index, integer, json, jsonb, pgEnum, pgSequence, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { syncStampColumns } from './columns.js';
import { organisations } from './organisations.table.js';
import { users } from './users.table.js';

/** One sequence for every synced table: a row's stamp orders it within its transaction's changes. */
export const syncChangeSeq = pgSequence('sync_change_seq');

export { syncStampColumns } from './columns.js';

/**
 * Per-field write history of a synced record: `{ [field]: { v: record version after the write,
 * c: client id of the writer } }`. A same-field write from a client whose base version is below `v`
 * (and who is not `c`) replaces a value it never saw: a conflict is kept.
 */
export const syncFieldsColumn = () => json('sync_fields').notNull().default({});

/** A phone (one browser database): whose it is and the last mutation id applied from it. */
export const syncClients = pgTable('sync_clients', {
  id: uuid('id').primaryKey(),
  organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
  userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  lastMutationId: bigint('last_mutation_id', { mode: 'number' }).notNull().default(0),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  lastPushAt: timestamp('last_push_at', { withTimezone: true }),
});

export const syncOutcomeEnum = pgEnum('sync_outcome', ['applied', 'conflict', 'rejected']);

/** What became of each mutation a phone sent (written in the push's transaction). */
export const syncMutations = pgTable(
  'sync_mutations',
  {
    clientId: uuid('client_id').notNull().references(() => syncClients.id, { onDelete: 'cascade' }),
    mutationId: bigint('mutation_id', { mode: 'number' }).notNull(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    entity: text('entity').notNull(),
    entityId: uuid('entity_id').notNull(),
    action: text('action').notNull(),
    outcome: syncOutcomeEnum('outcome').notNull(),
    reason: text('reason'),
    appliedAt: timestamp('applied_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.clientId, t.mutationId] })],
);

export const syncConflictStatusEnum = pgEnum('sync_conflict_status', ['open', 'resolved']);

/** A value replaced by a write whose author had not seen it: kept until someone settles it. */
export const syncConflicts = pgTable(
  'sync_conflicts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    entity: text('entity').notNull(),
    entityId: uuid('entity_id').notNull(),
    field: text('field').notNull(),
    /** The value the later write left in place. */
    currentValue: jsonb('current_value'),
    /** The value it replaced (the earlier writer's work). */
    replacedValue: jsonb('replaced_value'),
    replacedVersion: integer('replaced_version').notNull(),
    replacedClientId: uuid('replaced_client_id'),
    /** Who wrote the replaced value, and when (the conflict card names them). */
    replacedUserId: uuid('replaced_user_id').references(() => users.id, { onDelete: 'set null' }),
    replacedAt: timestamp('replaced_at', { withTimezone: true }),
    winnerClientId: uuid('winner_client_id').notNull(),
    winnerUserId: uuid('winner_user_id').references(() => users.id, { onDelete: 'set null' }),
    mutationId: bigint('mutation_id', { mode: 'number' }).notNull(),
    status: syncConflictStatusEnum('status').notNull().default('open'),
    resolution: text('resolution'),
    resolvedBy: uuid('resolved_by').references(() => users.id, { onDelete: 'set null' }),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    ...syncStampColumns(),
  },
  (t) => [
    index('sync_conflicts_org_status_idx').on(t.organisationId, t.status),
    index('sync_conflicts_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
  ],
);

export const syncTombstoneReasonEnum = pgEnum('sync_tombstone_reason', ['deleted', 'archived', 'out-of-scope']);

/**
 * A record the phones must drop, stamped like every synced row so it travels in the same feed.
 * Written in the transaction that archives, deletes or moves the record out of someone's scope
 * (triggers in the custom migration `sync_tombstones_triggers`). `userId` set: only that user's
 * phones drop it (a foreman reassigned away); null: every phone of the organisation.
 */
export const syncTombstones = pgTable(
  'sync_tombstones',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'cascade' }),
    recordType: text('record_type').notNull(),
    recordId: text('record_id').notNull(),
    reason: syncTombstoneReasonEnum('reason').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    ...syncStampColumns(),
  },
  (t) => [index('sync_tombstones_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq)],
);
