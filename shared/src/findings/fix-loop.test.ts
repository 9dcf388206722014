import { describe, expect, it } from 'vitest';
import { DEFAULT_ORGANISATION_SETTINGS, readOrganisationSettings } from '../organisations/organisation-settings.schema.js';
import { describeDue, fixDueAt, isAlterationControl, madeSafeLapsesAt, mustBeMadeSafeNow } from './fix-loop.js';

const raised = new Date('2026-03-10T09:00:00Z');

describe('the permanent-fix clock', () => {
  it('gives a High finding 24 hours and a Medium one 72 hours by default (common practice, no source)', () => {
    expect(fixDueAt('High', raised, DEFAULT_ORGANISATION_SETTINGS, null)?.toISOString()).toBe('2026-03-11T09:00:00.000Z');
    expect(fixDueAt('Medium', raised, DEFAULT_ORGANISATION_SETTINGS, null)?.toISOString()).toBe('2026-03-13T09:00:00.000Z');
  });

  it("follows the organisation's own hours", () => {
    const settings = readOrganisationSettings({ fixDueHours: { High: 4, Medium: 48 } });
    expect(fixDueAt('High', raised, settings, null)?.toISOString()).toBe('2026-03-10T13:00:00.000Z');
    expect(fixDueAt('Medium', raised, settings, null)?.toISOString()).toBe('2026-03-12T09:00:00.000Z');
  });

  it("makes a Low finding due before the scaffold's next inspection", () => {
    const next = new Date('2026-03-17T08:00:00Z');
    expect(fixDueAt('Low', raised, DEFAULT_ORGANISATION_SETTINGS, next)).toEqual(next);
    expect(fixDueAt('Low', raised, DEFAULT_ORGANISATION_SETTINGS, null)).toBeNull();
  });
});

describe('the made-safe clock', () => {
  it('asks for a High finding to be made safe now unless the zone below is closed', () => {
    expect(mustBeMadeSafeNow('High', 'public')).toBe(true);
    expect(mustBeMadeSafeNow('High', 'hard-hats')).toBe(true);
    expect(mustBeMadeSafeNow('High', 'zone-closed')).toBe(false);
    expect(mustBeMadeSafeNow('Medium', 'public')).toBe(false);
  });

  it('lapses at the end of the shift in the organisation time zone, in winter and in summer time', () => {
    // London is UTC+0 in March before the change and UTC+1 after 29 March 2026.
    expect(madeSafeLapsesAt(new Date('2026-03-10T09:00:00Z'), DEFAULT_ORGANISATION_SETTINGS).toISOString()).toBe('2026-03-10T17:00:00.000Z');
    expect(madeSafeLapsesAt(new Date('2026-06-10T09:00:00Z'), DEFAULT_ORGANISATION_SETTINGS).toISOString()).toBe('2026-06-10T16:00:00.000Z');
  });

  it('lapses at the next shift end when made safe after the shift', () => {
    expect(madeSafeLapsesAt(new Date('2026-03-10T18:30:00Z'), DEFAULT_ORGANISATION_SETTINGS).toISOString()).toBe('2026-03-11T17:00:00.000Z');
  });

  it('crosses the spring daylight-saving change', () => {
    // Made safe on Saturday 28 March 2026 after the shift; the next shift end is Sunday 17:00 BST = 16:00 UTC.
    expect(madeSafeLapsesAt(new Date('2026-03-28T20:00:00Z'), DEFAULT_ORGANISATION_SETTINGS).toISOString()).toBe('2026-03-29T16:00:00.000Z');
  });

  it('reads another time zone', () => {
    const settings = readOrganisationSettings({ timeZone: 'America/New_York', shiftEndsAt: '15:30' });
    expect(madeSafeLapsesAt(new Date('2026-07-01T12:00:00Z'), settings).toISOString()).toBe('2026-07-01T19:30:00.000Z');
  });
});

describe('due times in words', () => {
  const now = new Date('2026-03-10T12:00:00Z');
  it('says how long is left or how late it is, never by colour alone', () => {
    expect(describeDue(new Date('2026-03-10T15:00:00Z'), now)).toEqual({ words: 'due in 3 h', overdue: false });
    expect(describeDue(new Date('2026-03-08T12:00:00Z'), now)).toEqual({ words: 'overdue by 2 days', overdue: true });
    expect(describeDue(new Date('2026-03-10T11:20:00Z'), now)).toEqual({ words: 'overdue by 40 min', overdue: true });
    expect(describeDue(null, now)).toEqual({ words: 'no due time', overdue: false });
  });
});

describe('alterations', () => {
  it('treats toe boards, brick guards, netting and fans as changes to the scaffold', () => {
    expect(isAlterationControl('fit-toe-board')).toBe(true);
    expect(isAlterationControl('fit-fan')).toBe(true);
    expect(isAlterationControl('tether')).toBe(false);
    expect(isAlterationControl(null)).toBe(false);
  });
});

describe('organisation settings', () => {
  it('fills defaults and keeps the valid fields of a partly broken stored value', () => {
    expect(readOrganisationSettings(undefined)).toEqual(DEFAULT_ORGANISATION_SETTINGS);
    const read = readOrganisationSettings({ digestHour: 99, keepPhotoLocation: true });
    expect(read.digestHour).toBe(6);
    expect(read.keepPhotoLocation).toBe(true);
  });
});
