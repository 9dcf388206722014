/**
 * The fix loop's vocabulary: the controls a fix or a made-safe measure can apply, the reasons a
 * foreman hands a finding back, and the two clocks of a finding (made safe, permanent fix).
 */
import { zoneOffsetMs } from '../common/time-zone.js';
import type { OrganisationSettings } from '../organisations/organisation-settings.schema.js';

/** What was done about an item. Trade controls against dropped objects (hierarchy: remove, lower, secure, contain, keep people away). */
export const FINDING_CONTROLS = [
  'tether',
  'move-back',
  'lower',
  'remove',
  'close-zone',
  'fit-toe-board',
  'fit-brick-guard',
  'fit-netting',
  'fit-fan',
] as const;
export type FindingControl = (typeof FINDING_CONTROLS)[number];

/**
 * Controls that change the scaffold itself. Such a fix is an alteration, made by the scaffold
 * contractor's people (in the US under a competent person, OSHA 29 CFR 1926.451(f)(7)); recording it
 * marks the scaffold altered, so it needs inspecting before use (UK WAHR 2005 reg. 12(4)(b)).
 */
export const ALTERATION_CONTROLS: readonly FindingControl[] = ['fit-toe-board', 'fit-brick-guard', 'fit-netting', 'fit-fan'];
export const isAlterationControl = (control: FindingControl | null | undefined): boolean =>
  control != null && ALTERATION_CONTROLS.includes(control);

/** Why a foreman returns a finding (a manager then reassigns it). */
export const HAND_BACK_REASONS = ['needs-scaffolders', 'not-my-area', 'cannot-fix'] as const;
export type HandBackReason = (typeof HAND_BACK_REASONS)[number];

type Band = 'Low' | 'Medium' | 'High';
type Exposure = 'public' | 'hard-hats' | 'zone-closed';

/**
 * When the permanent fix is due: High and Medium after the organisation's hours from when the
 * finding was raised; Low before the scaffold's next inspection (null when that is unknown).
 */
export function fixDueAt(band: Band, raisedAt: Date, settings: Pick<OrganisationSettings, 'fixDueHours'>, nextInspectionDueAt: Date | null): Date | null {
  if (band === 'Low') return nextInspectionDueAt;
  return new Date(raisedAt.getTime() + settings.fixDueHours[band] * 3_600_000);
}

/** A High finding with anyone exposed below must be made safe (or its zone closed) before the inspector leaves the bay. */
export const mustBeMadeSafeNow = (band: Band, exposure: Exposure): boolean => band === 'High' && exposure !== 'zone-closed';

/**
 * A made-safe measure lapses at the end of the shift it was taken in: the next `shiftEndsAt` in the
 * organisation's time zone after `madeSafeAt` (daylight-saving changes included).
 */
export function madeSafeLapsesAt(madeSafeAt: Date, settings: Pick<OrganisationSettings, 'shiftEndsAt' | 'timeZone'>): Date {
  const [hour, minute] = settings.shiftEndsAt.split(':').map(Number) as [number, number];
  const local = new Date(madeSafeAt.getTime() + zoneOffsetMs(madeSafeAt.getTime(), settings.timeZone));
  for (let day = 0; day < 3; day += 1) {
    const wallAsUtc = Date.UTC(local.getUTCFullYear(), local.getUTCMonth(), local.getUTCDate() + day, hour, minute);
    // The offset at the shift end may differ from the one when made safe (a daylight-saving change): settle it.
    let end = wallAsUtc - zoneOffsetMs(wallAsUtc, settings.timeZone);
    end = wallAsUtc - zoneOffsetMs(end, settings.timeZone);
    if (end > madeSafeAt.getTime()) return new Date(end);
  }
  throw new Error('No shift end within three days');
}

export interface DueWords {
  /** "due in 3 h", "due in 2 days", "overdue by 40 min", "overdue by 2 days"; "no due time" without one. */
  words: string;
  overdue: boolean;
}

function span(ms: number): string {
  const minutes = Math.round(ms / 60_000);
  if (minutes < 60) return `${Math.max(1, minutes)} min`;
  const hours = Math.round(ms / 3_600_000);
  if (hours < 48) return `${hours} h`;
  const days = Math.round(ms / 86_400_000);
  return `${days} days`;
}

/** The due time in words, so lateness is never shown by colour alone. */
export function describeDue(dueAt: Date | null, now: Date): DueWords {
  if (!dueAt) return { words: 'no due time', overdue: false };
  const left = dueAt.getTime() - now.getTime();
  return left >= 0 ? { words: `due in ${span(left)}`, overdue: false } : { words: `overdue by ${span(-left)}`, overdue: true };
}
