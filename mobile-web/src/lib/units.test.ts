import { describe, expect, it } from 'vitest';
import { formatForInput, formatQuantity, formatWind, fromDisplay, parseDecimal, parseQuantity, parseWind, toDisplay } from './units';

describe('display units', () => {
  it('shows SI values with their unit, forces past 1,000 N in kilonewtons', () => {
    expect(formatQuantity('speed', 14.234, 'si')).toBe('14.2 m/s');
    expect(formatQuantity('energy', 49.03, 'si')).toBe('49 J');
    expect(formatQuantity('force', 4810, 'si')).toBe('4.81 kN');
    expect(formatQuantity('energy', 12_345, 'si')).toBe('12,345 J');
  });

  it('converts to imperial with exact factors (NIST SP 811 App. B: 1 ft = 0.3048 m, 1 lb = 0.45359237 kg)', () => {
    expect(toDisplay('height', 3.048, 'imperial')).toBeCloseTo(10, 12); // NIST SP 811 (2008) App. B.9: 1 ft = 0.3048 m
    expect(toDisplay('mass', 0.45359237, 'imperial')).toBeCloseTo(1, 12); // NIST SP 811 (2008) App. B.9: 1 lb = 0.45359237 kg
    expect(toDisplay('size', 0.0254, 'imperial')).toBeCloseTo(1, 12); // NIST SP 811 (2008) App. B.9: 1 in = 0.0254 m
    expect(formatQuantity('force', 4.4482216152605 * 100, 'imperial')).toBe('100 lbf'); // NIST SP 811 (2008) App. B.9: 1 lbf = 4.448222 N
  });

  it('round-trips a typed value to SI and back', () => {
    for (const kind of ['mass', 'height', 'size', 'speed', 'energy', 'force'] as const) {
      expect(toDisplay(kind, fromDisplay(kind, 12.5, 'imperial'), 'imperial')).toBeCloseTo(12.5, 10);
    }
    expect(parseQuantity('size', '30', 'si')).toBeCloseTo(0.3, 12);
    expect(formatForInput('size', 0.3, 'si')).toBe('30');
    expect(formatForInput('height', undefined, 'si')).toBe('');
  });

  it('shows and reads wind in its own unit (NIST SP 811 App. B: 1 mph = 0.44704 m/s, 1 km/h = 1/3.6 m/s)', () => {
    expect(formatWind(0.44704 * 20, 'mph')).toBe('20 mph');
    expect(formatWind(10, 'kmh')).toBe('36 km/h');
    expect(formatWind(7.5, 'mps')).toBe('7.5 m/s');
    expect(parseWind('20', 'mph')).toBeCloseTo(8.9408, 12); // NIST SP 811 (2008) App. B.9: 1 mph = 0.44704 m/s
    expect(parseWind('36', 'kmh')).toBeCloseTo(10, 12); // 1 km/h = 1000 m / 3600 s (SI definition)
    expect(parseWind('2,5', 'mps')).toBe(2.5);
    expect(parseWind('calm', 'mph')).toBeUndefined();
  });

  it('reads a decimal comma and refuses text that is not a number', () => {
    expect(parseDecimal('2,5')).toBe(2.5);
    expect(parseDecimal(' 12 ')).toBe(12);
    expect(parseDecimal('.5')).toBe(0.5);
    expect(parseDecimal('')).toBeUndefined();
    expect(parseDecimal('12 m')).toBeUndefined();
    expect(parseDecimal('1e400')).toBeUndefined();
  });
});
