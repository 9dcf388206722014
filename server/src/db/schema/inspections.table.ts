import { boolean, index, json, jsonb, pgEnum, pgTable, real, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { createdAt, syncStampColumns, updatedAt, version } from './columns.js';
import { organisations } from './organisations.table.js';
import { scaffolds, scaffoldStatusEnum } from './sites.table.js';
import { users } from './users.table.js';

export const inspectionReasonEnum = pgEnum('inspection_reason', ['scheduled', 'after-alteration', 'after-bad-weather', 'handover', 'pre-shift']);

/** Ids are generated on the phone (offline), so they are never defaulted here. */
export const inspections = pgTable(
  'inspections',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    scaffoldId: uuid('scaffold_id').notNull().references(() => scaffolds.id, { onDelete: 'cascade' }),
    inspectorId: uuid('inspector_id').notNull().references(() => users.id),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    reason: inspectionReasonEnum('reason').notNull(),
    windSpeedMps: real('wind_speed_mps'),
    // Statutory report fields (UK WAHR Schedule 7).
    reportFor: text('report_for').notNull().default(''),
    location: text('location').notNull().default(''),
    equipment: text('equipment').notNull().default(''),
    mattersGivingRisk: text('matters_giving_risk').notNull().default(''),
    actionTaken: text('action_taken').notNull().default(''),
    furtherAction: text('further_action').notNull().default(''),
    reporterName: text('reporter_name').notNull().default(''),
    reporterPosition: text('reporter_position').notNull().default(''),
    /** Optional drawn signature as an SVG path string. */
    signature: text('signature'),
    signedAt: timestamp('signed_at', { withTimezone: true }),
    // The outcome recorded when signing: the tag status given, the restriction when limited, tags changed.
    tagStatus: scaffoldStatusEnum('tag_status'),
    restriction: text('restriction').notNull().default(''),
    accessTagsChanged: boolean('access_tags_changed'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    /** Per-field write history for the merge of pushed edits (see sync.table.ts). */
    syncFields: json('sync_fields').notNull().default({}),
    ...syncStampColumns(),
  },
  (t) => [
    index('inspections_org_scaffold_idx').on(t.organisationId, t.scaffoldId),
    index('inspections_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
  ],
);

export const controlEnum = pgEnum('control', [
  'toe-boards',
  'brick-guards',
  'netting-or-sheeting',
  'fans-or-canopies',
  'exclusion-zone-barriers',
  'tool-tethering',
  'material-storage',
  'chutes-and-lowering',
  'loading-bay-gates',
  'guardrail-mesh',
]);
export const controlResultEnum = pgEnum('control_result', ['pass', 'fail', 'not-applicable']);

export const controlChecks = pgTable(
  'control_checks',
  {
    id: uuid('id').primaryKey(),
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    inspectionId: uuid('inspection_id').notNull().references(() => inspections.id, { onDelete: 'cascade' }),
    control: controlEnum('control').notNull(),
    result: controlResultEnum('result').notNull(),
    note: text('note').notNull().default(''),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    version: version(),
    syncFields: json('sync_fields').notNull().default({}),
    ...syncStampColumns(),
  },
  (t) => [
    unique('control_checks_inspection_control_uq').on(t.inspectionId, t.control),
    index('control_checks_feed_idx').on(t.organisationId, t.syncXid, t.syncSeq),
  ],
);
