/**
 * Triggers: something happened that could weaken the scaffold, so it is closed to use and its
 * inspection falls due at once, before anyone uses it again.
 * - UK WAHR 2005 reg. 12(4)(b): inspect after exceptional circumstances liable to jeopardise its
 *   safety (an alteration, adverse weather);
 * - US OSHA 29 CFR 1926.451(f)(3): after any occurrence which could affect its structural integrity.
 */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, LIMITS } from '../common/fields.schema.js';
import type { InspectionReason } from '../inspections/inspection.schema.js';
import { ScaffoldSchema, type ScaffoldStatus } from '../scaffolds/scaffold.schema.js';
import type { Jurisdiction } from '../sites/jurisdiction.js';

export const SCAFFOLD_TRIGGER_KINDS = ['altered', 'adverse-weather'] as const;
export const ScaffoldTriggerKindSchema = z.enum(SCAFFOLD_TRIGGER_KINDS);
export type ScaffoldTriggerKind = z.infer<typeof ScaffoldTriggerKindSchema>;

/** Body of POST /scaffolds/:id/trigger. */
export const ScaffoldTriggerCreateSchema = z.object({
  kind: ScaffoldTriggerKindSchema,
  /** What happened: "Ties moved on lift 3", "Gusts over 20 m/s overnight". */
  note: z.string().trim().min(1, 'Say what happened').max(LIMITS.noteMax),
});
export type ScaffoldTriggerCreate = z.infer<typeof ScaffoldTriggerCreateSchema>;

/** A recorded trigger; `answeredBy` is the inspection signed after it (null while it waits). */
export const ScaffoldTriggerSchema = z.object({
  id: IdSchema,
  scaffoldId: IdSchema,
  kind: ScaffoldTriggerKindSchema,
  note: z.string(),
  recordedBy: IdSchema,
  recordedAt: DateTimeSchema,
  answeredBy: IdSchema.nullable(),
});
export type ScaffoldTrigger = z.infer<typeof ScaffoldTriggerSchema>;

/** Answer of POST /scaffolds/:id/trigger: the scaffold as it now stands, and the trigger recorded. */
export const ScaffoldTriggerResultSchema = z.object({ scaffold: ScaffoldSchema, trigger: ScaffoldTriggerSchema });
export type ScaffoldTriggerResult = z.infer<typeof ScaffoldTriggerResultSchema>;

/** Plummet's words for each trigger. */
export const SCAFFOLD_TRIGGER_WORDS: Readonly<Record<ScaffoldTriggerKind, string>> = {
  altered: 'Altered',
  'adverse-weather': 'Adverse weather',
};

/** The regulation that calls for an inspection after the trigger, by jurisdiction. */
export const TRIGGER_REGULATION: Readonly<Record<Jurisdiction, string>> = {
  uk: 'UK WAHR 2005 reg. 12(4)(b)',
  us: 'US OSHA 29 CFR 1926.451(f)(3)',
};

/** The reason the inspection that answers a trigger records. */
export const TRIGGER_INSPECTION_REASON: Readonly<Record<ScaffoldTriggerKind, InspectionReason>> = {
  altered: 'after-alteration',
  'adverse-weather': 'after-bad-weather',
};

/**
 * What a trigger does to the scaffold: closed to use (not merely due) and its inspection due at
 * the moment it was recorded, whatever the regime said before.
 */
export function applyTrigger(at: Date): { status: ScaffoldStatus; nextDueAt: Date } {
  return { status: 'closed', nextDueAt: at };
}
