/**
 * The physics against values published outside this project: unit and constant definitions,
 * helmet test energies, ISA air density from its defining constants, textbook worked examples of
 * terminal speed. Each expected value names its source beside it; a value recalled from memory
 * (not re-read in the printed source for this release) says so. Handbook drag coefficients are
 * checked through the shape model in drag.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { feetToMetres, footPoundsToJoules, poundsForceToNewtons, poundsToKilograms } from '../units/conversions.js';
import { assessDrop } from './assess.js';
import { ISA_SEA_LEVEL_AIR_DENSITY, STANDARD_GRAVITY } from './constants.js';
import { dragAreaFromShape } from './drag.js';
import { terminalVelocity } from './fall.js';

describe('definitions and constants', () => {
  it('uses standard gravity 9.80665 m/s²: 1 kg dropped 1 m in vacuum lands with 9.80665 J', () => {
    expect(STANDARD_GRAVITY).toBe(9.80665); // 3rd CGPM (1901), declaration on the unit of mass and standard gravity; ISO 80000-3:2019, g_n
    expect(assessDrop({ massKg: 1, heightM: 1 }).impactEnergyJ).toBeCloseTo(9.80665, 12); // m g_n h with g_n from the same definitions
  });

  it('converts 20 ft with the international foot, 0.3048 m exactly: 6.096 m', () => {
    expect(feetToMetres(20)).toBe(6.096); // NIST SP 811 (2008), Appendix B.9 "Length": 1 ft = 3.048 E−01 m exactly (1959 international yard and pound agreement)
  });

  it('converts the 8 lb Z89.1 striker with the international pound, 0.45359237 kg exactly: 3.629 kg', () => {
    expect(poundsToKilograms(1)).toBe(0.45359237); // NIST SP 811 (2008), Appendix B.9 "Mass": 1 lb (avoirdupois) = 4.535 923 7 E−01 kg exactly
    expect(poundsToKilograms(8)).toBeCloseTo(3.62873896, 12); // 8 × 0.45359237, the striker ANSI/ISEA Z89.1 rounds to 3.6 kg
  });

  it('gives the 1,000 lbf Z89.1 force limit as about 4,448 N and a foot pound-force as 1.355818 J', () => {
    expect(poundsForceToNewtons(1000)).toBeCloseTo(4448.2216152605, 9); // NIST SP 811 (2008), Appendix B.9 "Force": 1 lbf = 4.448 222 E+00 N
    expect(footPoundsToJoules(1)).toBeCloseTo(1.355818, 6); // NIST SP 811 (2008), Appendix B.9 "Energy": 1 ft·lbf = 1.355 818 E+00 J
  });

  it('takes the ISA sea-level density that follows from the ISA defining constants: ρ = p/(R T) = 1.2250 kg/m³', () => {
    // ICAO Doc 7488/3 (Manual of the ICAO Standard Atmosphere), sea-level constants: p0 = 101 325 Pa,
    // T0 = 288.15 K, R = 287.05287 J/(kg·K) (recalled from memory), tabulated ρ0 = 1.225 kg/m³.
    expect(101_325 / (287.05287 * 288.15)).toBeCloseTo(ISA_SEA_LEVEL_AIR_DENSITY, 4);
  });
});

describe('helmet test energies', () => {
  it('gives the EN 397 shock test 49.0 J: a 5 kg striker dropped 1 m', () => {
    // EN 397:2012+A1:2012, shock absorption: 5 kg striker, 1 m drop (≈ 49 J), transmitted force ≤ 5.0 kN.
    expect(assessDrop({ massKg: 5, heightM: 1 }).impactEnergyJ).toBeCloseTo(49.0, 1);
  });

  it('gives the ANSI/ISEA Z89.1 Type I striker from 1.524 m (5 ft) about 5.5 m/s and 54 J', () => {
    // ANSI/ISEA Z89.1-2014, Type I force transmission: 3.6 kg striker, 5.5 m/s nominal impact speed (a 5 ft drop), ≤ 4,450 N
    // (drop height recalled from memory).
    const drop = assessDrop({ massKg: 3.6, heightM: feetToMetres(5) });
    expect(drop.impactVelocityMps).toBeCloseTo(5.5, 1); // 5.47 m/s in free fall
    expect(drop.impactEnergyJ).toBeCloseTo(54, 0); // 53.8 J; ½ × 3.6 × 5.5² = 54.45 J at the nominal speed
  });
});

describe('textbook worked examples of terminal speed', () => {
  it('gives a raindrop of radius 1.5 mm with C = 0.60 a terminal speed of 7.4 m/s', () => {
    // Halliday, Resnick & Walker, Fundamentals of Physics, ch. 6 sample problem "terminal speed of a falling raindrop":
    // R = 1.5 mm, C = 0.60, ρ_air = 1.2 kg/m³, water 1000 kg/m³, g = 9.8 m/s² → v_t = 7.4 m/s (recalled from memory).
    const r = 0.0015;
    const mass = (4 / 3) * Math.PI * r ** 3 * 1000;
    expect(terminalVelocity(mass, 0.6 * Math.PI * r * r, 1.2, 9.8)).toBeCloseTo(7.4, 1);
  });

  it('gives a baseball (7 cm, 0.15 kg) a terminal speed of about 35 m/s, and the sphere model within 5 % of it', () => {
    // Taylor, Classical Mechanics (2005), §2.4: quadratic drag f = γ D² v² with γ = 0.25 N·s²/m⁴ for air at STP;
    // for a baseball (D = 7 cm, m = 0.15 kg) v_t = √(m g / (γ D²)) ≈ 35 m/s (recalled from memory).
    const gammaD2 = 0.25 * 0.07 * 0.07;
    expect(terminalVelocity(0.15, (2 * gammaD2) / ISA_SEA_LEVEL_AIR_DENSITY)).toBeCloseTo(35, 0);
    // The same ball through the sphere model (Cd 0.47, Hoerner) at ISA density: within 5 % of Taylor's 35 m/s.
    const modelled = terminalVelocity(0.15, dragAreaFromShape({ kind: 'sphere', diameterM: 0.07 }));
    expect(Math.abs(modelled - 35) / 35).toBeLessThan(0.05);
  });
});
