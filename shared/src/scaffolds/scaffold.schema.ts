/** Scaffolds: one structure on a site, with its elevations, lifts and bays, status and foreman. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NoteSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema, queryList } from '../common/list.schema.js';

/** Trade practice: the tag on the scaffold. */
export const SCAFFOLD_STATUSES = ['Safe to use', 'Restricted use', 'Do not use'] as const;
export const ScaffoldStatusSchema = z.enum(SCAFFOLD_STATUSES);
export type ScaffoldStatus = z.infer<typeof ScaffoldStatusSchema>;

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
  status: ScaffoldStatusSchema,
  /** The foreman responsible: must be a foreman of the organisation. */
  foremanId: IdSchema.nullable(),
};

export const ScaffoldCreateSchema = z.object({
  siteId: IdSchema,
  ...scaffoldFields,
  description: scaffoldFields.description.default(''),
  status: scaffoldFields.status.default('Safe to use'),
  foremanId: scaffoldFields.foremanId.default(null),
});
export type ScaffoldCreate = z.infer<typeof ScaffoldCreateSchema>;

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
