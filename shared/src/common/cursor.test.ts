import { describe, expect, it } from 'vitest';
import { decodeCursor, encodeCursor } from './cursor.js';

describe('keyset cursors', () => {
  it('round-trip a position with any text, number or null value', () => {
    for (const value of ['Quayside Library – façade ✓', 12, null, '2025-03-04T09:30:00.000Z']) {
      const position = { sort: 'name', order: 'asc' as const, value, id: '0f8fad5b-d9cb-469f-a165-70867728950e' };
      const cursor = encodeCursor(position);
      expect(cursor).toMatch(/^[A-Za-z0-9_-]+$/);
      expect(decodeCursor(cursor, 'name', 'asc')).toEqual(position);
    }
  });

  it('refuses a cursor made for another sort or order', () => {
    const cursor = encodeCursor({ sort: 'riskScore', order: 'desc', value: 20, id: 'x' });
    expect(decodeCursor(cursor, 'dueAt', 'desc')).toBeNull();
    expect(decodeCursor(cursor, 'riskScore', 'asc')).toBeNull();
  });

  it('refuses garbage without throwing', () => {
    for (const junk of ['%%%', 'abc', encodeCursor({ sort: 's', order: 'asc', value: 1, id: 'i' }).slice(0, 5), 'W10']) {
      expect(decodeCursor(junk, 's', 'asc')).toBeNull();
    }
  });
});
