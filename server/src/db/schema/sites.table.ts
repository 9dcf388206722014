import { date, index, integer, pgEnum, pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { createdAt, syncStampColumns, updatedAt, version } from './columns.js';
import { organisations } from './organisations.table.js';
import { syncFieldsColumn } from './sync.table.js';
import { users } from './users.table.js';

export const inspectionRegimeEnum = pgEnum('inspection_regime', ['7-day', 'pre-shift']);
/** The rules a site works under (regulation references and pass criteria); the same values as JURISDICTIONS in shared. */
export const jurisdictionEnum = pgEnum('jurisdiction', ['uk', 'us']);
/** The duty a scaffold was designed for (EN 12811-1 classes or OSHA duty ratings); the same values as LOAD_CLASSES in shared. */
export const loadClassEnum = pgEnum('load_class', [
  'class-1',
  'class-2',
  'class-3',
  'class-4',
  'class-5',
  'class-6',
  'light-duty',
  'medium-duty',
  'heavy-duty',
]);

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
    jurisdiction: jurisdictionEnum('jurisdiction').notNull().default('uk'),
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
    /** The usual height of one lift; `liftHeightsM` lists each lift's when they differ (empty: all the same). */
    liftHeightM: real('lift_height_m').notNull(),
    liftHeightsM: real('lift_heights_m').array().notNull().default([]),
    baysPerElevation: integer('bays_per_elevation').notNull(),
    status: scaffoldStatusEnum('status').notNull().default('closed'),
    foremanId: uuid('foreman_id').references(() => users.id, { onDelete: 'set null' }),
    /** Its own inspection regime; null follows the site's. */
    regime: inspectionRegimeEnum('regime'),
    /** The handover record: design duty, design reference, who erected it and when it was handed over. */
    loadClass: loadClassEnum('load_class'),
    designReference: text('design_reference').notNull().default(''),
    erectingContractor: text('erecting_contractor').notNull().default(''),
    handedOverOn: date('handed_over_on', { mode: 'string' }),
    lastInspectedAt: timestamp('last_inspected_at', { withTimezone: true }),
    nextDueAt: timestamp('next_due_at', { withTimezone: true }),
    /** Last changed by a fix that alters the scaffold (toe boards, guards, netting, fans): inspect before use. */
    alteredAt: timestamp('altered_at', { withTimezone: true }),
    /** Set when a manager archives the scaffold (struck, no longer on site): it leaves the phones. */
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    /** Who last wrote the tag status, through a phone's push or REST (scaffold-commands.ts merges on it). */
    syncFields: syncFieldsColumn(),
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
