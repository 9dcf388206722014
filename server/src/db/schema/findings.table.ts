import { bigserial, index, integer, json, jsonb, pgEnum, pgTable, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { sql } from 'drizzle-orm';
import { createdAt, updatedAt, version } from './columns.js';
import { catalogueItems } from './catalogue.table.js';
import { inspections } from './inspections.table.js';
import { organisations } from './organisations.table.js';
import { scaffolds } from './sites.table.js';
import { users } from './users.table.js';
import { syncFieldsColumn, syncStampColumns } from './sync.table.js';

export const findingStateEnum = pgEnum('finding_state', ['open', 'made-safe', 'fixed', 'verified']);
export const exposureEnum = pgEnum('exposure', ['public', 'hard-hats', 'zone-closed']);
export const riskBandEnum = pgEnum('risk_band', ['Low', 'Medium', 'High']);

/**
 * One unsecured item or failed control. The estimate columns are always computed on the server
 * with the shared physics from the item fields; a client's figure is never stored.
 */
export const findings = pgTable(
  'findings',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    inspectionId: uuid('inspection_id').references(() => inspections.id, { onDelete: 'set null' }),
    scaffoldId: uuid('scaffold_id').notNull().references(() => scaffolds.id, { onDelete: 'cascade' }),
    elevation: text('elevation').notNull(),
    lift: integer('lift').notNull(),
    bay: integer('bay').notNull(),
    heightM: real('height_m').notNull(),
    catalogueItemId: uuid('catalogue_item_id').references(() => catalogueItems.id, { onDelete: 'set null' }),
    itemName: text('item_name').notNull(),
    massKg: real('mass_kg').notNull(),
    /** ShapeSpec from the shared physics (kind, dimensions in metres, orientation). */
    shape: jsonb('shape'),
    exposure: exposureEnum('exposure').notNull(),
    likelihoodAnswers: jsonb('likelihood_answers').notNull(),
    likelihood: integer('likelihood').notNull(),
    /** The server-computed fall estimate (SI units). */
    estimate: json('estimate').notNull(),
    /**
     * The estimate as a pulled row (shared/src/sync/finding-rows.ts), JSON text written with it
     * (finding-input.ts); read only by the pull. NULL for an estimate stored before rows, or of
     * another shape: that one travels as its object. A trigger (migration 0020) empties it whenever
     * the estimate changes without it, so it never describes an older estimate.
     */
    estimateRow: text('estimate_row'),
    severity: integer('severity').notNull(),
    riskScore: integer('risk_score').notNull(),
    riskBand: riskBandEnum('risk_band').notNull(),
    state: findingStateEnum('state').notNull().default('open'),
    assigneeId: uuid('assignee_id').references(() => users.id, { onDelete: 'set null' }),
    dueAt: timestamp('due_at', { withTimezone: true }),
    notes: text('notes').notNull().default(''),
    madeSafeNote: text('made_safe_note'),
    // The fix loop: the made-safe measure (control, closed zone radius, proof photos) and when it lapses.
    madeSafeControl: text('made_safe_control'),
    zoneRadiusM: real('zone_radius_m'),
    madeSafePhotoIds: uuid('made_safe_photo_ids').array().notNull().default(sql`'{}'::uuid[]`),
    madeSafeUntil: timestamp('made_safe_until', { withTimezone: true }),
    /** FindingHandBackSchema: the latest hand back by a foreman, cleared by the next assignment. */
    handBack: jsonb('hand_back'),
    /**
     * When its first fix was made: kept by triggers on fixes (any path that writes a fix), read only
     * by the median time to fix, which then needs no join or grouping of fixes. Never sent to clients.
     */
    firstFixedAt: timestamp('first_fixed_at', { withTimezone: true }),
    createdBy: uuid('created_by').notNull().references(() => users.id),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    // Sync: change-feed stamp and per-field write history.
    ...syncStampColumns(),
    syncFields: syncFieldsColumn(),
  },
  (t) => [
    index('findings_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
    index('findings_org_scaffold_idx').on(t.organisationId, t.scaffoldId),
    index('findings_org_state_risk_idx').on(t.organisationId, t.state, t.riskScore),
    // The default list (highest risk first) and its keyset pages: ORDER BY risk_score DESC, id DESC.
    index('findings_org_risk_id_idx').on(t.organisationId, t.riskScore, t.id),
    index('findings_assignee_idx').on(t.assigneeId),
    // The overview counts unfinished findings per scaffold and band from this index alone (index-only scan).
    index('findings_overview_idx').on(t.organisationId, t.state, t.scaffoldId, t.riskBand, t.dueAt),
    // Trends by the week raised, repeat locations over the last 30 days and the band of a fixed or
    // verified finding, all read from this index alone (index-only scans): every column they use is in it.
    index('findings_trends_idx').on(t.organisationId, t.createdAt, t.riskBand, t.scaffoldId, t.lift, t.bay, t.elevation, t.id),
    // The median time to fix: findings first fixed in a period, read from this index alone.
    index('findings_first_fix_idx')
      .on(t.organisationId, t.firstFixedAt, t.riskBand, t.createdAt, t.scaffoldId)
      .where(sql`${t.firstFixedAt} IS NOT NULL`),
    // Findings count of each inspection in the reports.
    index('findings_inspection_idx').on(t.inspectionId),
  ],
);

export const fixes = pgTable(
  'fixes',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    findingId: uuid('finding_id').notNull().references(() => findings.id, { onDelete: 'cascade' }),
    fixedBy: uuid('fixed_by').notNull().references(() => users.id),
    fixedAt: timestamp('fixed_at', { withTimezone: true }).notNull(),
    note: text('note').notNull().default(''),
    /** FINDING_CONTROLS; an alteration control marks the scaffold altered. */
    control: text('control'),
    /** Proof photos (photos owned by this fix; they may upload later). */
    photoIds: uuid('photo_ids').array().notNull().default(sql`'{}'::uuid[]`),
    createdAt: createdAt(),
    ...syncStampColumns(),
  },
  (t) => [
    index('fixes_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
    index('fixes_finding_idx').on(t.findingId),
    // First fix per finding for the median time to fix.
    index('fixes_org_finding_idx').on(t.organisationId, t.findingId, t.fixedAt),
  ],
);

export const verificationOutcomeEnum = pgEnum('verification_outcome', ['verified', 'reopened']);

export const verifications = pgTable(
  'verifications',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    findingId: uuid('finding_id').notNull().references(() => findings.id, { onDelete: 'cascade' }),
    verifiedBy: uuid('verified_by').notNull().references(() => users.id),
    verifiedAt: timestamp('verified_at', { withTimezone: true }).notNull(),
    outcome: verificationOutcomeEnum('outcome').notNull(),
    note: text('note').notNull().default(''),
    photoIds: uuid('photo_ids').array().notNull().default(sql`'{}'::uuid[]`),
    createdAt: createdAt(),
    ...syncStampColumns(),
  },
  (t) => [
    index('verifications_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
    index('verifications_finding_idx').on(t.findingId),
    // Findings closed per week in the trends, read from this index alone.
    index('verifications_trends_idx').on(t.organisationId, t.verifiedAt, t.outcome, t.findingId),
  ],
);

/** Who changed what and when, with the record before and after; written in the same transaction. */
export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    entityType: text('entity_type').notNull(),
    entityId: text('entity_id').notNull(),
    action: text('action').notNull(),
    before: json('before'),
    after: json('after'),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_events_org_entity_idx').on(t.organisationId, t.entityType, t.entityId)],
);
