import { index, jsonb, pgTable, real, text, uuid } from 'drizzle-orm/pg-core';
import { createdAt, syncStampColumns, updatedAt, version } from './columns.js';
import { organisations } from './organisations.table.js';

/** Items with a typical mass and shape. organisationId null = built in, shared by everyone. */
export const catalogueItems = pgTable(
  'catalogue_items',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').references(() => organisations.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    category: text('category').notNull(),
    massKg: real('mass_kg').notNull(),
    shape: jsonb('shape').notNull(),
    /** Where the mass and size come from (a standard, a maker's data sheet, a measurement). */
    source: text('source').notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    ...syncStampColumns(),
  },
  (t) => [index('catalogue_items_org_idx').on(t.organisationId), index('catalogue_items_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq)],
);
