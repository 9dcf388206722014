import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  feetToMetres,
  footPoundsToJoules,
  joulesToFootPounds,
  kilogramsToPounds,
  kmhToMetresPerSecond,
  metresPerSecondToKmh,
  metresPerSecondToMph,
  metresToFeet,
  mphToMetresPerSecond,
  newtonsToPoundsForce,
  poundsForceToNewtons,
  poundsToKilograms,
} from './conversions.js';
import { joules, kilograms, metres, metresPerSecond, newtons } from './quantities.js';

describe('unit conversions', () => {
  it('converts pounds and kilograms with the exact international pound', () => {
    expect(poundsToKilograms(1)).toBe(0.45359237); // NIST SP 811 (2008) App. B: 1 lb = 0.45359237 kg exactly
    expect(kilogramsToPounds(kilograms(0.45359237))).toBeCloseTo(1, 14); // same definition, inverted
    expect(poundsToKilograms(8)).toBeCloseTo(3.6287, 4); // ANSI/ISEA Z89.1 striker: 8 lb ≈ 3.6 kg
  });

  it('converts feet and metres with the exact international foot', () => {
    expect(feetToMetres(1)).toBe(0.3048); // NIST SP 811 (2008) App. B: 1 ft = 0.3048 m exactly
    expect(metresToFeet(metres(100))).toBeCloseTo(328.084, 3); // NIST SP 811: 1 m = 3.280840 ft
  });

  it('converts speeds to miles per hour and kilometres per hour', () => {
    expect(mphToMetresPerSecond(1)).toBeCloseTo(0.44704, 15); // NIST SP 811 App. B: 1 mph = 0.44704 m/s exactly
    expect(metresPerSecondToMph(metresPerSecond(26.8224))).toBeCloseTo(60, 12); // 60 × 0.44704 = 26.8224
    expect(metresPerSecondToKmh(metresPerSecond(10))).toBeCloseTo(36, 12); // 1 km/h = 1000/3600 m/s by definition
    expect(kmhToMetresPerSecond(100)).toBeCloseTo(27.7778, 4); // 100 000 m / 3600 s
  });

  it('converts energy to foot pound-force and force to pound-force', () => {
    expect(footPoundsToJoules(1)).toBeCloseTo(1.355818, 6); // NIST SP 811 App. B: 1 ft·lbf = 1.355818 J
    expect(poundsForceToNewtons(1)).toBeCloseTo(4.448222, 6); // NIST SP 811 App. B: 1 lbf = 4.448222 N
    expect(newtonsToPoundsForce(newtons(4450))).toBeCloseTo(1000, 0); // ANSI/ISEA Z89.1 limit 4450 N ≈ 1000 lbf
    expect(joulesToFootPounds(joules(1.3558179483314004))).toBeCloseTo(1, 12); // exact product of the two definitions
  });

  it('round-trips every conversion', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e6, noNaN: true }), (x) => {
        const close = (a: number) => Math.abs(a - x) <= 1e-12 * x;
        return (
          close(kilogramsToPounds(poundsToKilograms(x))) &&
          close(metresToFeet(feetToMetres(x))) &&
          close(metresPerSecondToMph(mphToMetresPerSecond(x))) &&
          close(metresPerSecondToKmh(kmhToMetresPerSecond(x))) &&
          close(joulesToFootPounds(footPoundsToJoules(x))) &&
          close(newtonsToPoundsForce(poundsForceToNewtons(x)))
        );
      }),
      { numRuns: 200 },
    );
  });
});
