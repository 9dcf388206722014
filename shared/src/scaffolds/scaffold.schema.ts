/** Scaffolds: one structure on a site, with its elevations, lifts and bays, status and foreman. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NoteSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema, queryList } from '../common/list.schema.js';

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
  baysPerElevation: z.number().int(),
  status: ScaffoldStatusSchema,
  foremanId: IdSchema.nullable(),
  lastInspectedAt: DateTimeSchema.nullable(),
  nextDueAt: DateTimeSchema.nullable(),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Scaffold = z.infer<typeof ScaffoldSchema>;

const scaffoldFields = {
  reference: z.string().trim().min(1).max(100),
  description: NoteSchema,
  /** Faces of the scaffold, e.g. "North", "Elevation A". */
  elevations: z
    .array(z.string().trim().min(1).max(50))
    .min(1)
    .max(12)
    .refine((list) => new Set(list).size === list.length, 'Elevation names must differ'),
  lifts: z.number().int().min(1).max(100),
  /** Height of one lift, m (a UK lift is typically 2 m). */
  liftHeightM: z.number().positive().max(5),
  baysPerElevation: z.number().int().min(1).max(200),
  /** The foreman responsible: must be a foreman of the organisation. */
  foremanId: IdSchema.nullable(),
};

export const ScaffoldCreateSchema = z.object({
  siteId: IdSchema,
  ...scaffoldFields,
  description: scaffoldFields.description.default(''),
  foremanId: scaffoldFields.foremanId.default(null),
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
