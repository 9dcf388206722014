import { describe, expect, it } from 'vitest';
import { formatDateTime, formatDay } from './format-date';

const intlDateTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
const intlDay = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });

/** Every month, single- and double-digit days, midnight, morning, noon and late evening. */
function sampleInstants(): string[] {
  const instants: string[] = [];
  for (const year of [1999, 2026]) {
    for (let month = 0; month < 12; month++) {
      for (const dayOfMonth of [1, 9, 10, 28]) {
        for (const [hour, minute] of [[0, 0], [0, 5], [9, 12], [12, 30], [23, 59]]) {
          instants.push(new Date(year, month, dayOfMonth, hour, minute).toISOString());
        }
      }
    }
  }
  return instants;
}

describe('dates as the phone shows them', () => {
  it('writes a date and time as Intl does for en-GB, in the phone’s time zone', () => {
    for (const iso of sampleInstants()) expect(formatDateTime(iso)).toBe(intlDateTime.format(new Date(iso)));
  });

  it('writes a day as Intl does for en-GB', () => {
    for (const iso of sampleInstants()) expect(formatDay(iso)).toBe(intlDay.format(new Date(iso)));
  });

  it('reads an instant with an offset in the phone’s time zone', () => {
    const iso = '2026-09-03T09:12:00+02:00';
    expect(formatDateTime(iso)).toBe(intlDateTime.format(new Date(iso)));
  });

  it('writes a dash for no date', () => {
    expect(formatDateTime(null)).toBe('—');
    expect(formatDay(undefined)).toBe('—');
    expect(formatDateTime('')).toBe('—');
  });
});
