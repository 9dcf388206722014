/**
 * When the next inspection of a scaffold is due after one finishes:
 * - `7-day` (UK WAHR 2005 reg. 12 and Schedule 7): 7 × 24 h after the finish;
 * - `pre-shift` (US OSHA 29 CFR 1926.451(f)(3)): the start (00:00) of the next calendar day in the
 *   site's time zone, so the next shift needs a fresh one.
 */
import { zoneOffsetMs } from '../common/time-zone.js';
import type { InspectionRegime } from '../sites/site.schema.js';

const DAY_MS = 86_400_000;

/** 00:00 local time of the calendar day after `instant` in `timeZone`. */
export function startOfNextDay(instant: Date, timeZone: string): Date {
  const local = new Date(instant.getTime() + zoneOffsetMs(instant.getTime(), timeZone));
  const nextMidnightAsUtc = Date.UTC(local.getUTCFullYear(), local.getUTCMonth(), local.getUTCDate() + 1);
  // The offset at midnight may differ from the one at `instant` (a DST change overnight): settle it.
  let guess = nextMidnightAsUtc - zoneOffsetMs(nextMidnightAsUtc, timeZone);
  guess = nextMidnightAsUtc - zoneOffsetMs(guess, timeZone);
  return new Date(guess);
}

export function nextInspectionDue(finishedAt: Date, regime: InspectionRegime, timeZone: string): Date {
  return regime === 'pre-shift' ? startOfNextDay(finishedAt, timeZone) : new Date(finishedAt.getTime() + 7 * DAY_MS);
}
