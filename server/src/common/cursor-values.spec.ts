import { describe, expect, it } from 'vitest';
import { castsCleanly } from './cursor-values.js';

describe('values from a cursor that PostgreSQL can cast', () => {
  it('accepts what the lists give out', () => {
    expect(castsCleanly('2026-12-02 06:45:07.123456+00', 'timestamptz')).toBe(true);
    expect(castsCleanly('infinity', 'timestamptz')).toBe(true);
    expect(castsCleanly('2024-02-29 00:00:00+00', 'timestamptz')).toBe(true);
    expect(castsCleanly('9223372036854775807', 'bigint')).toBe(true);
    expect(castsCleanly('-12', 'integer')).toBe(true);
    expect(castsCleanly('0.35', 'real')).toBe(true);
    expect(castsCleanly('0b6f2a7e-3c1d-4f0e-9a8b-1c2d3e4f5a6b', 'uuid')).toBe(true);
  });

  it('refuses forged values that would fail inside the query', () => {
    expect(castsCleanly('yesterday-ish', 'timestamptz')).toBe(false);
    expect(castsCleanly('2026-02-30 00:00:00+00', 'timestamptz')).toBe(false);
    expect(castsCleanly('2023-02-29 00:00:00+00', 'timestamptz')).toBe(false);
    expect(castsCleanly('2026-12-02 25:00:00+00', 'timestamptz')).toBe(false);
    expect(castsCleanly('9223372036854775808', 'bigint')).toBe(false);
    expect(castsCleanly('2147483648', 'integer')).toBe(false);
    expect(castsCleanly('1e9999', 'real')).toBe(false);
    expect(castsCleanly('1e999', 'real')).toBe(false);
    expect(castsCleanly('not-a-uuid', 'uuid')).toBe(false);
    expect(castsCleanly('nul\u0000inside', 'text')).toBe(false);
  });
});
