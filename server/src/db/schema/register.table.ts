import { index, pgEnum, pgTable, real, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { catalogueItems } from './catalogue.table.js';
import { createdAt, updatedAt, version } from './columns.js';
import { inspections } from './inspections.table.js';
import { organisations } from './organisations.table.js';
import { scaffolds } from './sites.table.js';
import { users } from './users.table.js';

/** SCAFFOLD_TRIGGER_KINDS of shared. */
export const scaffoldTriggerKindEnum = pgEnum('scaffold_trigger_kind', ['altered', 'adverse-weather']);

/**
 * "Altered" or "adverse weather" recorded on a scaffold (UK WAHR 2005 reg. 12(4)(b)): the scaffold
 * was closed and its inspection made due at once. The next signed inspection of the scaffold answers
 * every trigger still waiting.
 */
export const scaffoldTriggers = pgTable(
  'scaffold_triggers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    scaffoldId: uuid('scaffold_id').notNull().references(() => scaffolds.id, { onDelete: 'cascade' }),
    kind: scaffoldTriggerKindEnum('kind').notNull(),
    note: text('note').notNull(),
    recordedBy: uuid('recorded_by').notNull().references(() => users.id),
    recordedAt: timestamp('recorded_at', { withTimezone: true }).notNull().defaultNow(),
    answeredBy: uuid('answered_by').references(() => inspections.id, { onDelete: 'set null' }),
  },
  (t) => [index('scaffold_triggers_waiting_idx').on(t.organisationId, t.scaffoldId, t.answeredBy)],
);

/**
 * The exclusion zone below one elevation of a scaffold: the heaviest item handled there (from the
 * catalogue), the wind speed the site works up to, and the width the site actually barriers. The
 * suggestion itself is computed by the shared rule from these and the scaffold's height; findings
 * play no part, so the zone does not shrink as they are fixed.
 */
export const exclusionZones = pgTable(
  'exclusion_zones',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    scaffoldId: uuid('scaffold_id').notNull().references(() => scaffolds.id, { onDelete: 'cascade' }),
    elevation: text('elevation').notNull(),
    heaviestItemId: uuid('heaviest_item_id').references(() => catalogueItems.id, { onDelete: 'set null' }),
    /** Wind speed up to which the site works at height, m/s (the drift is sized for it). */
    limitingWindMps: real('limiting_wind_mps'),
    /** The width barriered below the elevation, measured out from its face, m. */
    barrieredWidthM: real('barriered_width_m'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
  },
  (t) => [unique('exclusion_zones_scaffold_elevation_uq').on(t.scaffoldId, t.elevation), index('exclusion_zones_org_idx').on(t.organisationId)],
);
