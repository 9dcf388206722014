import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessDrop } from './assess.js';
import { STANDARD_GRAVITY as G, ISA_SEA_LEVEL_AIR_DENSITY as RHO } from './constants.js';
import { riseWithDrag, speedFromRest, stillAirFall, terminalVelocity, vacuumSpeed } from './fall.js';

describe('worked values', () => {
  it('free fall with no drag reaches v = √(2gh)', () => {
    const drop = assessDrop({ massKg: 1, heightM: 10 });
    expect(drop.impactVelocityMps).toBeCloseTo(14.00475, 5); // v = √(2 × 9.80665 × 10) = √196.133, free fall (energy conservation)
    expect(drop.fallTimeS).toBeCloseTo(1.42809, 5); // t = √(2h/g) = √(20 / 9.80665), free fall
    expect(drop.terminalVelocityMps).toBe(Infinity); // no drag area given: no terminal speed
  });

  it('gives the EN 397 striker energy: 5 kg × 9.80665 m/s² × 1 m = 49.0 J', () => {
    const drop = assessDrop({ massKg: 5, heightM: 1 });
    expect(drop.impactEnergyJ).toBeCloseTo(49.03, 2); // EN 397:2012 shock absorption test, 5 kg dropped 1 m
  });

  it('gives the ANSI/ISEA Z89.1 Type I energy: 3.6 kg at 5.5 m/s = 54.5 J', () => {
    const heightM = (5.5 * 5.5) / (2 * G); // drop height that gives 5.5 m/s in free fall
    const drop = assessDrop({ massKg: 3.6, heightM });
    expect(drop.impactVelocityMps).toBeCloseTo(5.5, 10); // ANSI/ISEA Z89.1-2014 Type I impact velocity
    expect(drop.impactEnergyJ).toBeCloseTo(54.45, 2); // ANSI/ISEA Z89.1 Type I, ½ × 3.6 × 5.5²
  });

  it('matches the textbook form v = v_t √(1 − e^(−2gh/v_t²)) at v_t = 40 m/s, h = 20 m: 18.65 m/s', () => {
    expect(speedFromRest(20, 40)).toBeCloseTo(18.65, 2); // closed form of Taylor, Classical Mechanics (2005) §2.4, hand-evaluated: 40 √(1 − e^(−2 × 9.80665 × 20 / 1600))
    const dragAreaM2 = (2 * 10 * G) / (RHO * 40 * 40); // a 10 kg item with v_t = 40 m/s
    const drop = assessDrop({ massKg: 10, heightM: 20, dragAreaM2 });
    expect(drop.terminalVelocityMps).toBeCloseTo(40, 10); // v_t = √(2mg/(ρ Cd A)) by construction
    expect(drop.impactVelocityMps).toBeCloseTo(18.65, 2); // same textbook form through assessDrop
  });

  it('gives 1 kg with Cd·A 0.02 m² a terminal speed of 28.30 m/s, and none without drag', () => {
    expect(terminalVelocity(1, 0.02)).toBeCloseTo(28.2939, 4); // derivation, hand-evaluated: √(2 × 9.80665 / (1.225 × 0.02)) = √800.543
    expect(terminalVelocity(1, 0)).toBe(Infinity); // no drag: no terminal speed
  });

  it('keeps a throw above terminal speed slowing towards terminal', () => {
    const fall = stillAirFall(50, 30, 10, G); // thrown down at 30 m/s, v_t = 10 m/s
    expect(fall.speedMps).toBeGreaterThan(10); // approaches v_t from above (closed form, v² = v_t² + (v0² − v_t²)e^(−2gh/v_t²))
    // v² = 100 + (900 − 100)·e^(−2 × 9.80665 × 50 / 100) = 100.0441 (closed form, hand-evaluated)
    expect(fall.speedMps).toBeCloseTo(10.0022, 4);
  });

  it('includes the rise of an upward toss in the fall time and the apex height', () => {
    const vacuum = stillAirFall(10, -5, Infinity, G);
    expect(vacuum.riseM).toBeCloseTo(25 / (2 * G), 12); // H = u²/2g, free flight
    expect(vacuum.timeS).toBeCloseTo((5 + Math.sqrt(25 + 2 * G * 10)) / G, 12); // t = (u + v)/g, free flight
    expect(vacuum.speedMps).toBeCloseTo(vacuumSpeed(10, -5), 12); // energy conservation: same as thrown down at 5 m/s
    const rise = riseWithDrag(5, 10, G);
    expect(rise.riseM).toBeLessThan(25 / (2 * G)); // drag lowers the apex (closed form H = (v_t²/2g) ln(1 + u²/v_t²))
    expect(rise.timeS).toBeCloseTo((10 / G) * Math.atan(0.5), 12); // t_up = (v_t/g) atan(u/v_t), closed form
  });
});

describe('fall properties', () => {
  const positive = (min: number, max: number) => fc.double({ min, max, noNaN: true });

  it('speed rises with height and never passes terminal from rest', () => {
    fc.assert(
      fc.property(positive(0.1, 80), positive(0.01, 300), positive(0.01, 300), (vt, a, b) => {
        const [low, high] = a < b ? [a, b] : [b, a];
        const vLow = speedFromRest(low, vt);
        const vHigh = speedFromRest(high, vt);
        return vLow <= vHigh * (1 + 1e-15) && vHigh <= vt; // monotone in h (up to rounding), bounded by v_t (closed form)
      }),
      { numRuns: 300 },
    );
  });

  it('energy rises with mass at a fixed drag area', () => {
    fc.assert(
      fc.property(positive(0.001, 50), positive(0.001, 50), positive(0.5, 300), positive(0.0001, 0.5), (a, b, heightM, dragAreaM2) => {
        const [light, heavy] = a < b ? [a, b] : [b, a];
        const eLight = assessDrop({ massKg: light, heightM, dragAreaM2 }).impactEnergyJ;
        const eHeavy = assessDrop({ massKg: heavy, heightM, dragAreaM2 }).impactEnergyJ;
        return eLight <= eHeavy * (1 + 1e-12); // monotone up to rounding when the masses are nearly equal
      }),
      { numRuns: 300 },
    );
  });

  it('drag never makes an item faster than in vacuum', () => {
    fc.assert(
      fc.property(positive(0.001, 50), positive(0.5, 300), positive(0, 0.5), positive(-20, 40), (massKg, heightM, dragAreaM2, v0) => {
        const drop = assessDrop({ massKg, heightM, dragAreaM2, initialVelocityMps: v0 });
        return drop.impactVelocityMps <= drop.vacuumImpactVelocityMps * (1 + 1e-12);
      }),
      { numRuns: 300 },
    );
  });
});
