import { describe, expect, it } from 'vitest';
import { crossingFraction, hermite, hermiteSlope } from './hermite.js';

// p(t) = 1 + 2t − t² + 0.5t³ − 0.25t⁴ + 0.1t⁵ on [0, h]: a quintic is reproduced exactly by quintic
// Hermite interpolation (Burden & Faires, Numerical Analysis, §3.4: Hermite interpolation is exact on
// polynomials up to its degree).
const p = (t: number) => 1 + 2 * t - t * t + 0.5 * t ** 3 - 0.25 * t ** 4 + 0.1 * t ** 5;
const dp = (t: number) => 2 - 2 * t + 1.5 * t * t - t ** 3 + 0.5 * t ** 4;
const ddp = (t: number) => -2 + 3 * t - 3 * t * t + 2 * t ** 3;

describe('quintic Hermite interpolation', () => {
  const h = 1.7;
  const args = [p(0), dp(0), ddp(0), p(h), dp(h), ddp(h), h] as const;

  it('reproduces a quintic and its slope exactly', () => {
    for (const s of [0, 0.13, 0.5, 0.87, 1]) {
      expect(hermite(...args, s)).toBeCloseTo(p(s * h), 12);
      expect(hermiteSlope(...args, s)).toBeCloseTo(dp(s * h), 12);
    }
  });

  it('finds where the interpolant crosses a level', () => {
    const target = p(0.6 * h);
    expect(crossingFraction(...args, target)).toBeCloseTo(0.6, 12); // target taken at 0.6 h; p is increasing on [0, h]
  });
});
