import { describe, expect, it } from 'vitest';
import { nextInspectionDue } from '../inspections/next-due.js';
import { compareDue, dueState, effectiveRegime, isOnDueList, REGIME_REGULATION, suggestedReason } from './inspection-due.js';
import { applyTrigger, TRIGGER_INSPECTION_REASON, TRIGGER_REGULATION } from './scaffold-trigger.js';

const at = (iso: string) => new Date(iso);

describe('triggers', () => {
  it('closes an altered scaffold and makes its inspection due at once (UK WAHR 2005 reg. 12(4)(b))', () => {
    const when = at('2026-03-04T10:00:00Z');
    expect(applyTrigger(when)).toEqual({ status: 'closed', nextDueAt: when });
    expect(TRIGGER_INSPECTION_REASON.altered).toBe('after-alteration');
    expect(TRIGGER_REGULATION.uk).toBe('UK WAHR 2005 reg. 12(4)(b)');
  });

  it('closes a scaffold after adverse weather too (UK WAHR 2005 reg. 12(4)(b); US OSHA 29 CFR 1926.451(f)(3))', () => {
    expect(applyTrigger(at('2026-01-10T06:00:00Z')).status).toBe('closed');
    expect(TRIGGER_INSPECTION_REASON['adverse-weather']).toBe('after-bad-weather');
    expect(TRIGGER_REGULATION.us).toBe('US OSHA 29 CFR 1926.451(f)(3)');
  });

  it('puts a triggered scaffold first on the due list, before use, whatever its due date said', () => {
    const scaffold = { nextDueAt: '2026-03-10T10:00:00Z', lastInspectedAt: '2026-03-03T10:00:00Z' };
    expect(dueState(scaffold, 'altered', at('2026-03-04T10:00:00Z'), 'Europe/London')).toBe('before-use');
    expect(suggestedReason('adverse-weather', scaffold.lastInspectedAt, '7-day')).toBe('after-bad-weather');
  });
});

describe('due states', () => {
  const london = 'Europe/London';

  it('names the regulation of each regime (UK WAHR 2005 reg. 12(4)(a); US OSHA 29 CFR 1926.451(f)(3))', () => {
    expect(REGIME_REGULATION['7-day']).toBe('UK WAHR 2005 reg. 12(4)(a)');
    expect(REGIME_REGULATION['pre-shift']).toBe('US OSHA 29 CFR 1926.451(f)(3)');
  });

  it("takes the scaffold's own regime over its site's", () => {
    expect(effectiveRegime('7-day', 'pre-shift')).toBe('pre-shift');
    expect(effectiveRegime('pre-shift', null)).toBe('pre-shift');
  });

  it('lists a 7-day scaffold on its seventh day and after it (UK WAHR 2005 reg. 12(4)(a))', () => {
    const finished = at('2026-03-02T15:00:00Z');
    const scaffold = { nextDueAt: nextInspectionDue(finished, '7-day', london), lastInspectedAt: finished };
    expect(dueState(scaffold, null, at('2026-03-08T15:00:00Z'), london)).toBe('later');
    expect(dueState(scaffold, null, at('2026-03-09T08:00:00Z'), london)).toBe('due-today');
    expect(dueState(scaffold, null, at('2026-03-09T15:00:01Z'), london)).toBe('overdue');
    expect(isOnDueList('due-today') && isOnDueList('overdue') && !isOnDueList('later')).toBe(true);
  });

  it('makes a pre-shift scaffold overdue at the next local midnight (US OSHA 29 CFR 1926.451(f)(3))', () => {
    const ny = 'America/New_York';
    // Finished 17:00 EST on 4 March (22:00Z); due 5 March 00:00 EST = 05:00Z.
    const finished = at('2026-03-04T22:00:00Z');
    const scaffold = { nextDueAt: nextInspectionDue(finished, 'pre-shift', ny), lastInspectedAt: finished };
    expect(scaffold.nextDueAt.toISOString()).toBe('2026-03-05T05:00:00.000Z');
    expect(dueState(scaffold, null, at('2026-03-04T23:00:00Z'), ny)).toBe('later');
    expect(dueState(scaffold, null, at('2026-03-05T06:00:00Z'), ny)).toBe('overdue');
    expect(suggestedReason(null, finished, 'pre-shift')).toBe('pre-shift');
  });

  it('counts "today" in the site\'s own time zone across a clock change (BST starts 29 March 2026 at 01:00Z)', () => {
    // Due 29 March 23:30 BST = 22:30Z; at 00:30Z on the 29th (00:30 GMT, same local day) it is due today.
    const scaffold = { nextDueAt: '2026-03-29T22:30:00Z', lastInspectedAt: '2026-03-22T22:30:00Z' };
    expect(dueState(scaffold, null, at('2026-03-29T00:30:00Z'), london)).toBe('due-today');
    // In Tokyo the same due time is already 30 March: not today on the 29th.
    expect(dueState(scaffold, null, at('2026-03-29T00:30:00Z'), 'Asia/Tokyo')).toBe('later');
  });

  it('tells due today from later by the calendar date in the site\'s zone, however far ahead', () => {
    // Zones far east and far west of Greenwich (UTC+14 and UTC-11) as well as near it.
    for (const zone of ['Pacific/Kiritimati', 'Pacific/Pago_Pago', london, 'Asia/Tokyo']) {
      const now = at('2026-03-29T00:30:00Z');
      for (const hoursAhead of [0, 12, 23, 24, 25, 36, 47, 48, 49, 72, 24 * 7]) {
        const nextDueAt = new Date(now.getTime() + hoursAhead * 3_600_000);
        const localDay = (instant: Date) => new Intl.DateTimeFormat('en-CA', { timeZone: zone, dateStyle: 'short' }).format(instant);
        const expected = localDay(nextDueAt) === localDay(now) ? 'due-today' : 'later';
        expect(dueState({ nextDueAt, lastInspectedAt: '2026-03-22T00:30:00Z' }, null, now, zone)).toBe(expected);
      }
    }
  });

  it('lists a scaffold never inspected for its handover inspection', () => {
    expect(dueState({ nextDueAt: null, lastInspectedAt: null }, null, at('2026-03-01T00:00:00Z'), london)).toBe('first-inspection');
    expect(suggestedReason(null, null, '7-day')).toBe('handover');
  });

  it('orders the list: waiting triggers, first inspections, overdue, due today; then by due time', () => {
    const items = [
      { state: 'due-today' as const, nextDueAt: '2026-03-01T12:00:00Z' },
      { state: 'overdue' as const, nextDueAt: '2026-02-27T12:00:00Z' },
      { state: 'overdue' as const, nextDueAt: '2026-02-25T12:00:00Z' },
      { state: 'before-use' as const, nextDueAt: '2026-03-01T09:00:00Z' },
    ];
    expect(items.sort(compareDue).map((i) => `${i.state} ${i.nextDueAt.slice(8, 10)}`)).toEqual(['before-use 01', 'overdue 25', 'overdue 27', 'due-today 01']);
  });
});
