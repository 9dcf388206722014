/** Inspections: one walk of one scaffold by one inspector, ending in the statutory report. */
import { z } from 'zod';
import {
  DateTimeSchema,
  IdSchema,
  LIMITS,
  NameSchema,
  NoteSchema,
  RequiredNoteSchema,
  ShortTextSchema,
  VersionSchema,
  WindSpeedMpsSchema,
} from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema } from '../common/list.schema.js';
import { ScaffoldStatusSchema } from '../scaffolds/scaffold.schema.js';
import { ControlCheckSchema } from './control-check.schema.js';
import { inspectionOutcomeFields, refineInspectionOutcome } from './inspection-outcome.js';

/**
 * Why the inspection is made: `handover` after erection (before first use), `scheduled` by the
 * regime, `after-alteration` and `after-bad-weather` (UK WAHR 2005 reg. 12(4)(b)), `pre-shift`
 * before the shift (US OSHA 29 CFR 1926.451(f)(3)).
 */
export const INSPECTION_REASONS = ['scheduled', 'after-alteration', 'after-bad-weather', 'handover', 'pre-shift'] as const;
export const InspectionReasonSchema = z.enum(INSPECTION_REASONS);
export type InspectionReason = z.infer<typeof InspectionReasonSchema>;

export const InspectionSchema = z.object({
  id: IdSchema,
  scaffoldId: IdSchema,
  inspectorId: IdSchema,
  startedAt: DateTimeSchema,
  finishedAt: DateTimeSchema.nullable(),
  reason: InspectionReasonSchema,
  windSpeedMps: z.number().nullable(),
  reportFor: z.string(),
  location: z.string(),
  equipment: z.string(),
  mattersGivingRisk: z.string(),
  actionTaken: z.string(),
  furtherAction: z.string(),
  reporterName: z.string(),
  reporterPosition: z.string(),
  signature: z.string().nullable(),
  signedAt: DateTimeSchema.nullable(),
  /** The outcome written on the tag when signing (null until finished, or from a phone that did not ask). */
  tagStatus: ScaffoldStatusSchema.nullable(),
  /** When limited: which lifts and bays, what load, in words. */
  restriction: z.string(),
  /** Whether the tags at every access point were changed to the recorded status. */
  accessTagsChanged: z.boolean().nullable(),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Inspection = z.infer<typeof InspectionSchema>;

/** One inspection with its control checks (the answer of GET /inspections/:id). */
export const InspectionDetailSchema = InspectionSchema.extend({ controlChecks: z.array(ControlCheckSchema) });
export type InspectionDetail = z.infer<typeof InspectionDetailSchema>;

/** Started on the phone with an id of its own: sending the same body again is harmless. */
export const InspectionCreateSchema = z.object({
  id: IdSchema,
  scaffoldId: IdSchema,
  reason: InspectionReasonSchema,
  windSpeedMps: WindSpeedMpsSchema.nullable().default(null),
  /** When the walk began on the phone; the server's clock when absent. */
  startedAt: DateTimeSchema.optional(),
});
export type InspectionCreate = z.infer<typeof InspectionCreateSchema>;

/** The fields of the statutory report (UK WAHR 2005 Schedule 7), as drafts while walking. */
const reportDraftFields = {
  reportFor: NoteSchema,
  location: NoteSchema,
  equipment: NoteSchema,
  mattersGivingRisk: NoteSchema,
  actionTaken: NoteSchema,
  furtherAction: NoteSchema,
  reporterName: ShortTextSchema,
  reporterPosition: ShortTextSchema,
};

export const InspectionUpdateSchema = z
  .object({
    reason: InspectionReasonSchema.optional(),
    windSpeedMps: WindSpeedMpsSchema.nullable().optional(),
    ...z.object(reportDraftFields).partial().shape,
    version: VersionSchema.optional(),
  })
  .refine((v) => Object.keys(v).some((k) => k !== 'version'), 'Nothing to change');
export type InspectionUpdate = z.infer<typeof InspectionUpdateSchema>;

/**
 * Finishing: every Schedule 7 field is required (for whom, where, what equipment, matters giving
 * rise to risk, action taken, further action, name and position of the person reporting).
 */
export const InspectionFinishSchema = z
  .object({
    reportFor: NameSchema,
    location: RequiredNoteSchema,
    equipment: RequiredNoteSchema,
    mattersGivingRisk: RequiredNoteSchema,
    actionTaken: RequiredNoteSchema,
    furtherAction: RequiredNoteSchema,
    reporterName: NameSchema,
    reporterPosition: NameSchema,
    /** A drawn signature as an SVG path string. */
    signature: z.string().min(1).max(LIMITS.signatureMax).nullable().default(null),
    /** When the inspector finished on the phone; the server's clock when absent. */
    finishedAt: DateTimeSchema.optional(),
    ...inspectionOutcomeFields,
  })
  .superRefine(refineInspectionOutcome);
export type InspectionFinish = z.infer<typeof InspectionFinishSchema>;

export const InspectionListQuerySchema = z.object({
  ...listQueryShape(['startedAt', 'createdAt', 'updatedAt'], 'startedAt', 'desc'),
  siteId: IdSchema.optional(),
  scaffoldId: IdSchema.optional(),
  inspectorId: IdSchema.optional(),
  finished: QueryBooleanSchema.optional(),
});
export type InspectionListQuery = z.infer<typeof InspectionListQuerySchema>;

export const InspectionListResponseSchema = listResponseSchema(InspectionSchema);
