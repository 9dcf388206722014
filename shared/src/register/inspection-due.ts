/**
 * The register: when each scaffold's next inspection is due and how that reads on a list.
 * - `7-day`: every 7 days, UK WAHR 2005 reg. 12(4)(a);
 * - `pre-shift`: before each shift, US OSHA 29 CFR 1926.451(f)(3);
 * - after an alteration or adverse weather, at once (see scaffold-trigger.ts).
 */
import { z } from 'zod';
import { DateTimeSchema, IdSchema } from '../common/fields.schema.js';
import { zoneOffsetMs } from '../common/time-zone.js';
import { type InspectionReason, InspectionReasonSchema } from '../inspections/inspection.schema.js';
import { ScaffoldStatusSchema } from '../scaffolds/scaffold.schema.js';
import { type InspectionRegime, InspectionRegimeSchema } from '../sites/site.schema.js';
import { ScaffoldTriggerKindSchema, type ScaffoldTriggerKind, TRIGGER_INSPECTION_REASON } from './scaffold-trigger.js';

/** The regulation behind each regime. */
export const REGIME_REGULATION: Readonly<Record<InspectionRegime, string>> = {
  '7-day': 'UK WAHR 2005 reg. 12(4)(a)',
  'pre-shift': 'US OSHA 29 CFR 1926.451(f)(3)',
};

/** Plummet's words for each regime. */
export const REGIME_WORDS: Readonly<Record<InspectionRegime, string>> = {
  '7-day': 'Every 7 days',
  'pre-shift': 'Before each shift',
};

/** A scaffold's own regime when it has one, else its site's. */
export const effectiveRegime = (siteRegime: InspectionRegime, scaffoldRegime: InspectionRegime | null | undefined): InspectionRegime =>
  scaffoldRegime ?? siteRegime;

/**
 * Where a scaffold stands in the register:
 * - `before-use`: a trigger waits for its inspection (closed to use until then);
 * - `first-inspection`: never inspected (a new scaffold is closed until its handover inspection);
 * - `overdue`: the due time is past;
 * - `due-today`: due later today in the site's time zone;
 * - `later`.
 */
export const DUE_STATES = ['before-use', 'first-inspection', 'overdue', 'due-today', 'later'] as const;
export const DueStateSchema = z.enum(DUE_STATES);
export type DueState = z.infer<typeof DueStateSchema>;

export const DUE_STATE_WORDS: Readonly<Record<DueState, string>> = {
  'before-use': 'Due now, before use',
  'first-inspection': 'First inspection due',
  overdue: 'Overdue',
  'due-today': 'Due today',
  later: 'Not yet due',
};

const TWO_DAYS_MS = 2 * 24 * 60 * 60 * 1000;

/** The local calendar date (YYYY-MM-DD) of an instant in a time zone. */
function localDate(instant: number, timeZone: string): string {
  return new Date(instant + zoneOffsetMs(instant, timeZone)).toISOString().slice(0, 10);
}

export function dueState(
  scaffold: { nextDueAt: Date | string | null; lastInspectedAt: Date | string | null },
  pendingTrigger: ScaffoldTriggerKind | null,
  now: Date,
  timeZone: string,
): DueState {
  if (pendingTrigger) return 'before-use';
  if (scaffold.nextDueAt === null) return scaffold.lastInspectedAt === null ? 'first-inspection' : 'later';
  const due = new Date(scaffold.nextDueAt).getTime();
  if (due < now.getTime()) return 'overdue';
  // Two instants two days apart or more never share a calendar date in one time zone (its offset
  // changes by a day at most), so most scaffolds need no look-up of the zone's dates, which is slow
  // the first time on a phone.
  if (due - now.getTime() >= TWO_DAYS_MS) return 'later';
  return localDate(due, timeZone) === localDate(now.getTime(), timeZone) ? 'due-today' : 'later';
}

/** States that put a scaffold on the due list. */
export const isOnDueList = (state: DueState): boolean => state !== 'later';

/** The reason the next inspection will most likely record (the inspector can choose another). */
export function suggestedReason(
  pendingTrigger: ScaffoldTriggerKind | null,
  lastInspectedAt: Date | string | null,
  regime: InspectionRegime,
): InspectionReason {
  if (pendingTrigger) return TRIGGER_INSPECTION_REASON[pendingTrigger];
  if (lastInspectedAt === null) return 'handover';
  return regime === 'pre-shift' ? 'pre-shift' : 'scheduled';
}

/** Most pressing first: waiting triggers, then never inspected, overdue, due today; by due time. */
export function compareDue(a: { state: DueState; nextDueAt: string | null }, b: { state: DueState; nextDueAt: string | null }): number {
  const rank = DUE_STATES.indexOf(a.state) - DUE_STATES.indexOf(b.state);
  if (rank !== 0) return rank;
  return (a.nextDueAt ?? '').localeCompare(b.nextDueAt ?? '');
}

export const RegisterDueQuerySchema = z.object({ siteId: IdSchema.optional() });
export type RegisterDueQuery = z.infer<typeof RegisterDueQuerySchema>;

/** One scaffold on the due list (GET /register/due). */
export const RegisterDueItemSchema = z.object({
  scaffoldId: IdSchema,
  reference: z.string(),
  siteId: IdSchema,
  siteName: z.string(),
  status: ScaffoldStatusSchema,
  regime: InspectionRegimeSchema,
  /** The regulation of the regime, e.g. "UK WAHR 2005 reg. 12(4)(a)". */
  regulation: z.string(),
  state: DueStateSchema,
  nextDueAt: DateTimeSchema.nullable(),
  lastInspectedAt: DateTimeSchema.nullable(),
  /** The trigger waiting for its inspection, if any. */
  trigger: z.object({ kind: ScaffoldTriggerKindSchema, note: z.string(), recordedAt: DateTimeSchema, regulation: z.string() }).nullable(),
  suggestedReason: InspectionReasonSchema,
});
export type RegisterDueItem = z.infer<typeof RegisterDueItemSchema>;

export const RegisterDueListSchema = z.object({ generatedAt: DateTimeSchema, items: z.array(RegisterDueItemSchema) });
export type RegisterDueList = z.infer<typeof RegisterDueListSchema>;
