import { describe, expect, it } from 'vitest';
import { formatDateTime } from '../../lib/format-date';
import { canTypeValue, ENTITY_WORDS, fieldWords, parseTypedValue, replacedWords, valueWords, writerWords } from './conflict-words';

describe('conflict words', () => {
  it('names fields and shows values in the user’s units', () => {
    expect(fieldWords('notes')).toBe('Notes');
    expect(valueWords('notes', '', 'si')).toBe('(empty)');
    expect(valueWords('exposure', 'public', 'si')).toBe('Public, no head protection');
    expect(valueWords('heightM', 3.048, 'imperial')).toMatch(/^10(\.0)? ft$/);
    expect(valueWords('item', { name: 'Brick', massKg: 2.3 }, 'si')).toBe('Brick, 2.3 kg');
    // A scaffold's tag, in Plummet's own words; chosen on the card, never typed.
    expect(fieldWords('status')).toBe('Tag status');
    expect(valueWords('status', 'limited', 'si')).toBe('Limited use');
    expect(canTypeValue('status')).toBe(false);
  });

  it('turns typed text into a value the server accepts, or says what is wrong', () => {
    expect(parseTypedValue('notes', 'Bagged', 'si')).toEqual({ value: 'Bagged' });
    expect(parseTypedValue('lift', '3', 'si')).toEqual({ value: 3 });
    expect(parseTypedValue('bay', '0', 'si')).toHaveProperty('problem');
    expect(parseTypedValue('heightM', '10', 'imperial')).toEqual({ value: expect.closeTo(3.048, 6) });
    expect(canTypeValue('item')).toBe(false);
    expect(parseTypedValue('item', 'x', 'si')).toHaveProperty('problem');
  });

  it('names who wrote the replaced value and when: you, their name, or another user when the server could not say', () => {
    const me = '0a000000-0000-4000-8000-000000000001';
    const other = '0a000000-0000-4000-8000-000000000002';
    const at = '2026-03-02T08:15:00.000Z';
    expect(replacedWords({ replacedUserId: me, replacedAt: at, replacedName: 'Ines Duarte' }, me)).toBe(`written by you, ${formatDateTime(at)}`);
    expect(replacedWords({ replacedUserId: other, replacedAt: at, replacedName: 'Tomas Berg' }, me)).toBe(`written by Tomas Berg, ${formatDateTime(at)}`);
    expect(replacedWords({ replacedUserId: other, replacedAt: at, replacedName: null }, me)).toBe(`written by another user, ${formatDateTime(at)}`);
    expect(replacedWords({ replacedUserId: null, replacedAt: null, replacedName: null }, me)).toBe('written on another phone');
    expect(writerWords(other, 'Tomas Berg', me)).toBe('Tomas Berg');
    expect(writerWords(null, null, me)).toBe('another user');
  });

  it('reads the fields of inspections, control checks and settings in words, wind in the user’s wind unit', () => {
    expect(fieldWords('actionTaken')).toBe('Action taken');
    expect(fieldWords('windSpeedMps')).toBe('Wind speed');
    expect(valueWords('windSpeedMps', 8.9408, 'si', 'mph')).toBe('20 mph');
    expect(valueWords('windSpeedMps', 10, 'si')).toBe('10 m/s');
    expect(fieldWords('result')).toBe('Result');
    expect(valueWords('result', 'not-applicable', 'si')).toBe('Not applicable');
    expect(fieldWords('windUnits')).toBe('Wind speed unit');
    expect(valueWords('units', 'imperial', 'si')).toBe('Imperial');
    expect(ENTITY_WORDS['control-check']).toBe('Control check');
  });
});
