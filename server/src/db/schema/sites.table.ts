import { index, integer, pgEnum, pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { createdAt, syncStampColumns, updatedAt, version } from './columns.js';
import { organisations } from './organisations.table.js';
import { users } from './users.table.js';

export const inspectionRegimeEnum = pgEnum('inspection_regime', ['7-day', 'pre-shift']);

export const sites = pgTable(
  'sites',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    address: text('address').notNull(),
    clientName: text('client_name').notNull(),
    /** The client the statutory report is made for (UK WAHR 2005 Schedule 7: name and address). */
    clientAddress: text('client_address').notNull().default(''),
    /** Optional: receives a copy of each report unless the organisation turns client copies off. */
    clientContactEmail: text('client_contact_email'),
    timeZone: text('time_zone').notNull().default('Europe/London'),
    regime: inspectionRegimeEnum('regime').notNull().default('7-day'),
    reportRecipients: text('report_recipients').array().notNull().default([]),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    ...syncStampColumns(),
  },
  (t) => [index('sites_org_idx').on(t.organisationId), index('sites_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq)],
);

export const scaffoldStatusEnum = pgEnum('scaffold_status', ['cleared', 'limited', 'closed']);

export const scaffolds = pgTable(
  'scaffolds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    siteId: uuid('site_id').notNull().references(() => sites.id, { onDelete: 'cascade' }),
    reference: text('reference').notNull(),
    description: text('description').notNull().default(''),
    elevations: text('elevations').array().notNull(),
    lifts: integer('lifts').notNull(),
    liftHeightM: real('lift_height_m').notNull(),
    baysPerElevation: integer('bays_per_elevation').notNull(),
    status: scaffoldStatusEnum('status').notNull().default('closed'),
    foremanId: uuid('foreman_id').references(() => users.id, { onDelete: 'set null' }),
    lastInspectedAt: timestamp('last_inspected_at', { withTimezone: true }),
    nextDueAt: timestamp('next_due_at', { withTimezone: true }),
    /** Last changed by a fix that alters the scaffold (toe boards, guards, netting, fans): inspect before use. */
    alteredAt: timestamp('altered_at', { withTimezone: true }),
    /** Set when a manager archives the scaffold (struck, no longer on site): it leaves the phones. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    ...syncStampColumns(),
  },
  (t) => [
    index('scaffolds_org_site_idx').on(t.organisationId, t.siteId),
    index('scaffolds_foreman_idx').on(t.foremanId),
    index('scaffolds_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
  ],
);

/** Managers responsible for a site; a site with none of its own reports to every manager of the organisation. */
export const siteManagers = pgTable(
  'site_managers',
  {
    siteId: uuid('site_id').notNull().references(() => sites.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.siteId, t.userId] }), index('site_managers_user_idx').on(t.userId)],
);
