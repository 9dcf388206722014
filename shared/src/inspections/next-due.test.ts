import { describe, expect, it } from 'vitest';
import { nextInspectionDue, startOfNextDay } from './next-due.js';

describe('nextInspectionDue', () => {
  it('puts the next inspection of a 7-day site exactly seven days later (UK WAHR 2005 reg. 12)', () => {
    const due = nextInspectionDue(new Date('2025-03-04T15:20:00Z'), '7-day', 'Europe/London');
    expect(due.toISOString()).toBe('2025-03-11T15:20:00.000Z');
  });

  it('puts the next inspection of a pre-shift site at the start of the next local day', () => {
    // 23:30 in New York on 4 March (EST, UTC−5) is 04:30Z on the 5th; the next local day starts 5 March 00:00 EST.
    const due = nextInspectionDue(new Date('2025-03-05T04:30:00Z'), 'pre-shift', 'America/New_York');
    expect(due.toISOString()).toBe('2025-03-05T05:00:00.000Z');
  });

  it('uses local midnight in summer time (BST, UTC+1)', () => {
    expect(startOfNextDay(new Date('2025-07-01T10:00:00Z'), 'Europe/London').toISOString()).toBe('2025-07-01T23:00:00.000Z');
  });

  it('finds the local midnight after a clock change overnight', () => {
    // London moves to BST on 30 March 2025 at 01:00Z; 31 March 00:00 BST is 30 March 23:00Z.
    expect(startOfNextDay(new Date('2025-03-30T12:00:00Z'), 'Europe/London').toISOString()).toBe('2025-03-30T23:00:00.000Z');
    // The night of the change: 29 March 22:00Z is still GMT; 30 March 00:00 GMT is 00:00Z.
    expect(startOfNextDay(new Date('2025-03-29T22:00:00Z'), 'Europe/London').toISOString()).toBe('2025-03-30T00:00:00.000Z');
  });
});
