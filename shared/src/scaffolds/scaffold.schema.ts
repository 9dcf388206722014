/** Scaffolds: one structure on a site, with its elevations, lifts and bays, status and foreman. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NoteSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema, queryList } from '../common/list.schema.js';
import { INSPECTION_REGIMES, type InspectionRegime, InspectionRegimeSchema } from '../sites/site.schema.js';
import { scaffoldHandoverFields } from './scaffold-handover.js';

/**
 * Tag status: what the last inspection recorded on the scaffold's tag, stored as neutral codes.
 * A new scaffold is `closed` until an inspection sets its status. Screens, e-mails and reports
 * show SCAFFOLD_STATUS_WORDS, always beside who recorded it and when: the app reports what a
 * competent person recorded and never calls a scaffold safe.
 */
export const SCAFFOLD_STATUSES = ['cleared', 'limited', 'closed'] as const;
export const ScaffoldStatusSchema = z.enum(SCAFFOLD_STATUSES);
export type ScaffoldStatus = z.infer<typeof ScaffoldStatusSchema>;

/** Plummet's own words for each tag status. */
export const SCAFFOLD_STATUS_WORDS: Readonly<Record<ScaffoldStatus, string>> = {
  cleared: 'Cleared for use',
  limited: 'Limited use',
  closed: 'Closed to use',
};

/** The words for a stored status (an unknown code is shown as it is). */
export const scaffoldStatusWords = (status: string): string => SCAFFOLD_STATUS_WORDS[status as ScaffoldStatus] ?? status;

/** How restrictive a status is: a clash between unseen edits keeps the more restrictive one. */
export const SCAFFOLD_STATUS_RESTRICTION: Readonly<Record<ScaffoldStatus, number>> = { cleared: 0, limited: 1, closed: 2 };

/** The more restrictive of two tag statuses. */
export const moreRestrictiveStatus = (a: ScaffoldStatus, b: ScaffoldStatus): ScaffoldStatus =>
  SCAFFOLD_STATUS_RESTRICTION[b] > SCAFFOLD_STATUS_RESTRICTION[a] ? b : a;

export const ScaffoldSchema = z.object({
  id: IdSchema,
  siteId: IdSchema,
  reference: z.string(),
  description: z.string(),
  elevations: z.array(z.string()),
  lifts: z.number().int(),
  liftHeightM: z.number(),
  /** One height per lift from the bottom, m; empty: every lift is `liftHeightM` (see liftHeightsOf). */
  liftHeightsM: z.array(z.number()),
  baysPerElevation: z.number().int(),
  status: ScaffoldStatusSchema,
  /** When the tag status was last set (a tag change, a signed inspection, a closure); null when not known. */
  statusSetAt: DateTimeSchema.nullable().default(null),
  foremanId: IdSchema.nullable(),
  /** Its own inspection regime; null: the site's. */
  regime: InspectionRegimeSchema.nullable(),
  ...scaffoldHandoverFields,
  lastInspectedAt: DateTimeSchema.nullable(),
  nextDueAt: DateTimeSchema.nullable(),
  /** When it was archived (struck or gone from the site); phones drop it at their next sync. */
  archivedAt: DateTimeSchema.nullable(),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Scaffold = z.infer<typeof ScaffoldSchema>;

/** Most lifts a scaffold may have. */
export const LIFTS_MAX = 100;
/** Tallest single lift, m. */
export const LIFT_HEIGHT_MAX_M = 5;

const LiftHeightSchema = z
  .number('A height in metres')
  .positive('More than 0 m')
  .max(LIFT_HEIGHT_MAX_M, `At most ${LIFT_HEIGHT_MAX_M} m`);

const scaffoldFields = {
  reference: z.string().trim().min(1, 'Give the scaffold a reference, e.g. A1').max(100, 'At most 100 characters'),
  description: NoteSchema,
  /** Faces of the scaffold, e.g. "North", "Elevation A". */
  elevations: z
    .array(z.string().trim().min(1, 'Name each elevation').max(50, 'At most 50 characters'))
    .min(1, 'At least one elevation')
    .max(12, 'At most 12 elevations')
    .refine((list) => new Set(list).size === list.length, 'Elevation names must differ'),
  lifts: z.number('A whole number of lifts').int('A whole number of lifts').min(1, 'At least 1 lift').max(LIFTS_MAX, `At most ${LIFTS_MAX} lifts`),
  /** The usual height of one lift, m (a UK lift is typically 2 m: common practice, no source). */
  liftHeightM: LiftHeightSchema,
  /** One height per lift from the bottom when they differ (as many as `lifts`); empty: all are `liftHeightM`. */
  liftHeightsM: z.array(LiftHeightSchema).max(LIFTS_MAX, `At most ${LIFTS_MAX} lifts`),
  baysPerElevation: z.number('A whole number of bays').int('A whole number of bays').min(1, 'At least 1 bay').max(200, 'At most 200 bays'),
  /** The foreman responsible: must be a foreman of the organisation. */
  foremanId: IdSchema.nullable(),
  /** Its own regime, or null to follow the site's. */
  regime: z.enum(INSPECTION_REGIMES, 'Every 7 days, before each shift, or the site\'s').nullable(),
  ...scaffoldHandoverFields,
};

/** The message when a list of lift heights does not match the number of lifts, or null when it fits. */
export function liftHeightsMismatch(lifts: number, liftHeightsM: readonly number[]): string | null {
  if (liftHeightsM.length === 0 || liftHeightsM.length === lifts) return null;
  return `Give one height for each of the ${lifts} lifts, or none to use the usual height for all`;
}

export const ScaffoldCreateSchema = z
  .object({
    siteId: IdSchema,
    ...scaffoldFields,
    description: scaffoldFields.description.default(''),
    foremanId: scaffoldFields.foremanId.default(null),
    liftHeightsM: scaffoldFields.liftHeightsM.default([]),
    regime: scaffoldFields.regime.default(null),
    loadClass: scaffoldFields.loadClass.default(null),
    designReference: scaffoldFields.designReference.default(''),
    erectingContractor: scaffoldFields.erectingContractor.default(''),
    handedOverOn: scaffoldFields.handedOverOn.default(null),
  })
  .superRefine((v, ctx) => {
    const mismatch = liftHeightsMismatch(v.lifts, v.liftHeightsM);
    if (mismatch) ctx.addIssue({ code: 'custom', path: ['liftHeightsM'], message: mismatch });
  });
export type ScaffoldCreate = z.infer<typeof ScaffoldCreateSchema>;
// A new scaffold is `closed` until an inspection (or a recorded status change) sets its tag status,
// so neither create nor update takes a status: POST /scaffolds/:id/status does, with its reason.

export const ScaffoldUpdateSchema = z
  .object({ ...z.object(scaffoldFields).partial().shape, version: VersionSchema.optional() })
  .refine((v) => Object.keys(v).some((k) => k !== 'version'), 'Nothing to change');
export type ScaffoldUpdate = z.infer<typeof ScaffoldUpdateSchema>;

/** A status change on site (inspector, manager or admin), with a reason. */
export const ScaffoldStatusChangeSchema = z.object({
  status: ScaffoldStatusSchema,
  note: NoteSchema.default(''),
});
export type ScaffoldStatusChange = z.infer<typeof ScaffoldStatusChangeSchema>;

export const ScaffoldListQuerySchema = z.object({
  ...listQueryShape(['reference', 'createdAt', 'updatedAt', 'nextDueAt'], 'reference', 'asc'),
  siteId: IdSchema.optional(),
  status: queryList(ScaffoldStatusSchema).optional(),
  foremanId: IdSchema.optional(),
  /** Inspection overdue: next due time in the past. */
  overdue: QueryBooleanSchema.optional(),
});
export type ScaffoldListQuery = z.infer<typeof ScaffoldListQuerySchema>;

export const ScaffoldListResponseSchema = listResponseSchema(ScaffoldSchema);
