/** Findings: one unsecured item or failed control, with its position, item, exposure and estimate. */
import { z } from 'zod';
import { ShapeSpecSchema } from '../catalogue/shape-spec.schema.js';
import {
  DateTimeSchema,
  HeightMSchema,
  IdSchema,
  MassKgSchema,
  NameSchema,
  NoteSchema,
  VersionSchema,
} from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema, queryList } from '../common/list.schema.js';
import type { LikelihoodAnswers } from '../risk/likelihood.js';
import { FINDING_EXPOSURES } from './finding-estimate.js';
import { FINDING_STATES } from './finding-state.js';
import { FINDING_CONTROLS, HAND_BACK_REASONS } from './fix-loop.js';

export const FindingStateSchema = z.enum(FINDING_STATES);
export const FindingExposureSchema = z.enum(FINDING_EXPOSURES);
export const RiskBandSchema = z.enum(['Low', 'Medium', 'High']);
export const FindingControlSchema = z.enum(FINDING_CONTROLS);
export const HandBackReasonSchema = z.enum(HAND_BACK_REASONS);

/** The latest hand back of a finding by a foreman, until a manager reassigns it. */
export const FindingHandBackSchema = z.object({
  reason: HandBackReasonSchema,
  note: z.string(),
  by: IdSchema,
  at: DateTimeSchema,
});

/** The inspector's answers behind the likelihood (shared/src/risk/likelihood.ts asks the questions). */
export const LikelihoodAnswersSchema = z.object({
  securing: z.enum(['secured', 'contained', 'loose']),
  edgeDistance: z.enum(['at-edge', 'near-edge', 'away']),
  activity: z.enum(['none', 'light', 'heavy']),
  wind: z.enum(['calm', 'breezy', 'strong']),
  footTraffic: z.enum(['none', 'occasional', 'frequent']),
});
// Fails to compile when the risk helper's questions and this schema drift apart.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const answersAgree: Same<z.infer<typeof LikelihoodAnswersSchema>, LikelihoodAnswers> = true;
void answersAgree;

/**
 * The item: a catalogue entry (its name, mass and shape are copied) or a custom item with a name,
 * mass and, when known, a shape (without one the estimate has no air drag: the worst case).
 */
export const FindingItemInputSchema = z
  .object({
    catalogueItemId: IdSchema.optional(),
    name: NameSchema.optional(),
    massKg: MassKgSchema.optional(),
    shape: ShapeSpecSchema.nullable().optional(),
  })
  .superRefine((item, ctx) => {
    if (item.catalogueItemId !== undefined) {
      for (const key of ['name', 'massKg', 'shape'] as const) {
        if (item[key] !== undefined) ctx.addIssue({ code: 'custom', path: [key], message: 'Give a catalogue item or a custom item, not both' });
      }
      return;
    }
    if (item.name === undefined) ctx.addIssue({ code: 'custom', path: ['name'], message: 'A custom item needs a name' });
    if (item.massKg === undefined) ctx.addIssue({ code: 'custom', path: ['massKg'], message: 'A custom item needs a mass in kg' });
  });
export type FindingItemInput = z.infer<typeof FindingItemInputSchema>;

/** The server's estimate, stored as computed (SI units). */
export const FindingEstimateSchema = z.object({
  terminalVelocityMps: z.number().nullable(),
  impactVelocityMps: z.number(),
  vacuumImpactVelocityMps: z.number(),
  fallTimeS: z.number(),
  riseM: z.number(),
  impactEnergyJ: z.number(),
  meanForceN: z.number(),
  peakForceN: z.number(),
  driftM: z.number(),
  /** The two impacts of an item in wind (the faster governs); absent on estimates stored before they were kept. */
  governingImpact: z.enum(['still-air', 'wind']).optional(),
  stillAirImpactVelocityMps: z.number().optional(),
  stillAirImpactEnergyJ: z.number().optional(),
  stillAirPeakForceN: z.number().optional(),
  windImpactVelocityMps: z.number().optional(),
  windImpactEnergyJ: z.number().optional(),
  windPeakForceN: z.number().optional(),
  severity: z.object({ level: z.number().int(), label: z.string(), basis: z.string() }),
  likelihood: z.object({ level: z.number().int(), label: z.string(), reasons: z.array(z.string()) }),
  resolved: z.record(z.string(), z.unknown()),
});

export const FindingSchema = z.object({
  id: IdSchema,
  inspectionId: IdSchema.nullable(),
  scaffoldId: IdSchema,
  elevation: z.string(),
  lift: z.number().int(),
  bay: z.number().int(),
  heightM: z.number(),
  item: z.object({
    catalogueItemId: IdSchema.nullable(),
    name: z.string(),
    massKg: z.number(),
    shape: ShapeSpecSchema.nullable(),
  }),
  exposure: FindingExposureSchema,
  likelihoodAnswers: LikelihoodAnswersSchema,
  likelihood: z.number().int(),
  estimate: FindingEstimateSchema,
  severity: z.number().int(),
  riskScore: z.number().int(),
  riskBand: RiskBandSchema,
  state: FindingStateSchema,
  assigneeId: IdSchema.nullable(),
  dueAt: DateTimeSchema.nullable(),
  /** Open or made safe, and past its due time. */
  overdue: z.boolean(),
  notes: z.string(),
  madeSafeNote: z.string().nullable(),
  /** When the made-safe measure lapses (end of the shift it was taken in) unless renewed; null when not made safe. */
  madeSafeUntil: DateTimeSchema.nullable(),
  /** Set when the assigned foreman handed the finding back; cleared by the next assignment. */
  handBack: FindingHandBackSchema.nullable(),
  /** The made-safe measure: the control taken, the radius of a closed zone (m), its proof photos. */
  madeSafeControl: FindingControlSchema.nullable().optional(),
  zoneRadiusM: z.number().nullable().optional(),
  madeSafePhotoIds: z.array(IdSchema).optional(),
  createdBy: IdSchema,
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Finding = z.infer<typeof FindingSchema>;

const findingFields = {
  elevation: z.string().trim().min(1).max(50),
  lift: z.number().int().min(1).max(100),
  bay: z.number().int().min(1).max(200),
  /** From the item down to the level where someone could be struck, m. */
  heightM: HeightMSchema,
  item: FindingItemInputSchema,
  exposure: FindingExposureSchema,
  likelihoodAnswers: LikelihoodAnswersSchema,
  notes: NoteSchema,
};

/**
 * Recorded on the phone with an id of its own: sending the same body again is harmless. Estimate
 * fields a client sends (estimate, severity, riskScore…) are not part of the shape and are dropped.
 */
export const FindingCreateSchema = z.object({
  id: IdSchema,
  scaffoldId: IdSchema,
  inspectionId: IdSchema.nullable().default(null),
  ...findingFields,
  notes: findingFields.notes.default(''),
});
export type FindingCreate = z.infer<typeof FindingCreateSchema>;

export const FindingUpdateSchema = z
  .object({ ...z.object(findingFields).partial().shape, version: VersionSchema.optional() })
  .refine((v) => Object.keys(v).some((k) => k !== 'version'), 'Nothing to change');
export type FindingUpdate = z.infer<typeof FindingUpdateSchema>;

export const FindingStateChangeSchema = z.object({
  to: FindingStateSchema,
  note: NoteSchema.default(''),
  /** The control applied (made safe, fixed); an alteration control marks the scaffold altered. */
  control: FindingControlSchema.optional(),
  /**
   * Proof photos, by the ids the phone gave them (their owner is the fix or verification
   * `recordId`, or the finding for made safe). Required for a High finding made safe or fixed when
   * the organisation asks for proof; the photos may upload after the change.
   */
  photoIds: z.array(IdSchema).max(10).default([]),
  /** Made safe by closing the zone below: its radius, m. */
  zoneRadiusM: z.number().positive().max(200).optional(),
  /**
   * Id for the fix or verification this change records, made on the phone so a proof photo can be
   * attached to it offline (photos with owner `fix` or `verification`); the server makes one if absent.
   */
  recordId: IdSchema.optional(),
});
export type FindingStateChange = z.infer<typeof FindingStateChangeSchema>;
/** As a client writes it (photoIds may be left out). */
export type FindingStateChangeInput = z.input<typeof FindingStateChangeSchema>;

/** A foreman returns a finding they cannot fix, with a reason a manager acts on. */
export const FindingHandBackInputSchema = z.object({
  reason: HandBackReasonSchema,
  note: NoteSchema.default(''),
});
export type FindingHandBackInput = z.infer<typeof FindingHandBackInputSchema>;

/** A fix as recorded (GET /findings/:id/history, the change feed). */
export const FixSchema = z.object({
  id: IdSchema,
  findingId: IdSchema,
  fixedBy: IdSchema,
  fixedAt: DateTimeSchema,
  note: z.string(),
  control: FindingControlSchema.nullable(),
  photoIds: z.array(IdSchema),
});
export type Fix = z.infer<typeof FixSchema>;

/** A verification or reopening of a fixed finding. */
export const VerificationSchema = z.object({
  id: IdSchema,
  findingId: IdSchema,
  verifiedBy: IdSchema,
  verifiedAt: DateTimeSchema,
  outcome: z.enum(['verified', 'reopened']),
  note: z.string(),
  photoIds: z.array(IdSchema),
});
export type Verification = z.infer<typeof VerificationSchema>;

/** One line of a finding's history, oldest first. */
export const FindingHistoryEntrySchema = z.object({
  kind: z.enum(['created', 'state', 'assign', 'hand-back', 'edit']),
  at: DateTimeSchema,
  by: IdSchema.nullable(),
  byName: z.string().nullable(),
  from: FindingStateSchema.nullable(),
  to: FindingStateSchema.nullable(),
  note: z.string(),
  control: FindingControlSchema.nullable(),
  reason: HandBackReasonSchema.nullable(),
  assigneeId: IdSchema.nullable(),
  /** The fix or verification this line recorded, when any. */
  recordId: IdSchema.nullable(),
  photoIds: z.array(IdSchema),
});
export type FindingHistoryEntry = z.infer<typeof FindingHistoryEntrySchema>;
export const FindingHistorySchema = z.object({ items: z.array(FindingHistoryEntrySchema) });

/** Hands a finding to a foreman of the organisation (or takes it back with null), with a due time. */
export const FindingAssignSchema = z.object({
  assigneeId: IdSchema.nullable(),
  dueAt: DateTimeSchema.nullable().default(null),
});
export type FindingAssign = z.infer<typeof FindingAssignSchema>;

/** Characters of a finding's note that a list row carries. */
export const NOTE_PREVIEW_MAX = 80;

/**
 * A finding as lists carry it: what a row of a table or list shows, and no estimate (the detail,
 * GET /findings/:id, has it whole, as does GET /findings?estimate=full). Keeps a page of 50
 * findings near 20 KB for phones and fast under load.
 */
export const FindingListItemSchema = z.object({
  id: IdSchema,
  scaffoldId: IdSchema,
  elevation: z.string(),
  lift: z.number().int(),
  bay: z.number().int(),
  heightM: z.number(),
  itemName: z.string(),
  riskScore: z.number().int(),
  riskBand: RiskBandSchema,
  state: FindingStateSchema,
  assigneeId: IdSchema.nullable(),
  dueAt: DateTimeSchema.nullable(),
  /** Open or made safe, and past its due time. */
  overdue: z.boolean(),
  /** The note's first NOTE_PREVIEW_MAX characters, ending in "…" when there is more. */
  notePreview: z.string(),
  /** When it was raised. */
  createdAt: DateTimeSchema,
});
export type FindingListItem = z.infer<typeof FindingListItemSchema>;

export const FindingListQuerySchema = z.object({
  ...listQueryShape(['riskScore', 'dueAt', 'createdAt', 'updatedAt', 'heightM'], 'riskScore', 'desc'),
  siteId: IdSchema.optional(),
  scaffoldId: IdSchema.optional(),
  inspectionId: IdSchema.optional(),
  state: queryList(FindingStateSchema).optional(),
  riskBand: queryList(RiskBandSchema).optional(),
  assigneeId: IdSchema.optional(),
  /** Open or made safe and past the due time. */
  overdue: QueryBooleanSchema.optional(),
  /** Raised at or after this instant. */
  raisedFrom: DateTimeSchema.optional(),
  /** Raised before this instant. */
  raisedTo: DateTimeSchema.optional(),
  /** Free text, matched case-insensitively within the item's name and the note. */
  q: z.string().trim().min(1).max(200).optional(),
  /** `summary` (default): rows of FindingListItemSchema, without the estimate; `full`: every item as GET /findings/:id answers it (FindingFullListResponseSchema). */
  estimate: z.enum(['summary', 'full']).default('summary'),
});
export type FindingListQuery = z.infer<typeof FindingListQuerySchema>;

export const FindingListResponseSchema = listResponseSchema(FindingListItemSchema);
/** The answer of GET /findings?estimate=full (parse with this one: the summary schema would drop the explanations). */
export const FindingFullListResponseSchema = listResponseSchema(FindingSchema);

/** GET /findings/export.csv: the list's filters and sort, every matching finding (no page, no limit). */
export const FindingExportQuerySchema = FindingListQuerySchema.omit({ limit: true, cursor: true, estimate: true });
export type FindingExportQuery = z.infer<typeof FindingExportQuerySchema>;
