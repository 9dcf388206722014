/**
 * Impact forces from the contact between the falling item and what it strikes.
 *
 * The item is assumed to stop without bouncing, so the impulse is m·v and the energy E = m v²/2:
 * - from a contact duration Δt: mean force F = m v / Δt;
 * - from a stopping distance d: mean force F = E / d;
 * - peak = mean × pulse factor (peak/mean of the pulse shape): rectangular 1, half-sine π/2,
 *   triangular 2. Half-sine is the usual shock-test pulse (IEC 60068-2-27).
 * When both a duration and a distance are given, the larger force is used.
 *
 * Presets, when the inspector gives neither: a hard item meets a spring (the skull or the helmet
 * shell and harness); a linear spring of stiffness k stopping a mass m takes a quarter period,
 * Δt = (π/2)√(m/k), with a half-sine force whose peak is v√(k m). A soft item crushes itself
 * over a distance.
 */
import type { Exposure } from './exposure.js';
import { STANDARD_GRAVITY } from './constants.js';

export type Pulse = 'rectangular' | 'half-sine' | 'triangular';
export const PULSES: readonly Pulse[] = ['rectangular', 'half-sine', 'triangular'];

/** Peak-to-mean ratio of each pulse shape (by integrating the shape over its duration). */
export const PULSE_FACTORS: Readonly<Record<Pulse, number>> = {
  rectangular: 1,
  'half-sine': Math.PI / 2,
  triangular: 2,
};

export type ItemHardness = 'hard' | 'soft';
export const ITEM_HARDNESSES: readonly ItemHardness[] = ['hard', 'soft'];

/** EN 397 shock test: 5 kg striker dropped 1 m, m g h = 49.0 J; transmitted force at most 5.0 kN. */
export const EN397_STRIKER_KG = 5;
export const EN397_DROP_M = 1;
export const EN397_ENERGY_J = EN397_STRIKER_KG * STANDARD_GRAVITY * EN397_DROP_M;
export const EN397_FORCE_N = 5000;

/**
 * ANSI/ISEA Z89.1 Type I force transmission: 3.6 kg striker at 5.5 m/s (dropped 1.524 m, 5 ft),
 * ½ m v² = 54.45 J; transmitted force at most 4,450 N.
 */
export const Z891_STRIKER_KG = 3.6;
export const Z891_IMPACT_SPEED_MPS = 5.5;
export const Z891_ENERGY_J = 0.5 * Z891_STRIKER_KG * Z891_IMPACT_SPEED_MPS * Z891_IMPACT_SPEED_MPS;
export const Z891_FORCE_N = 4450;

/** Mean dynamic stiffness of the cadaver skull, 4023 N/mm (Yoganandan et al. 1995, J Neurotrauma 12(4):659–668). */
export const SKULL_STIFFNESS_N_PER_M = 4_023_000;
/** Mean dynamic deflection of the skull at fracture, 5.8 mm (Yoganandan et al. 1995). */
export const SKULL_DEFLECTION_M = 0.0058;
/**
 * The helmet as the linear spring through the EN 397 pass point: a spring stopping energy E peaks at
 * F = √(2 E k), so a helmet that just passes (5.0 kN from 49.0 J) has k = F²/(2E) ≈ 255 N/mm, the
 * stiffest helmet EN 397 allows: the worst case for a site where EN 397 helmets are worn. It does
 * not claim ANSI/ISEA Z89.1 Type I: that test (4,450 N at 54.45 J) needs k ≤ 182 N/mm, and this
 * spring gives its striker about 5.2 kN, so for a Z89.1 helmet the preset errs high.
 */
export const HELMET_STIFFNESS_N_PER_M = (EN397_FORCE_N * EN397_FORCE_N) / (2 * EN397_ENERGY_J);
/** Largest deflection of that spring at the EN 397 pass point, 2E/F ≈ 19.6 mm. */
export const HELMET_STROKE_AT_EN397_M = (2 * EN397_ENERGY_J) / EN397_FORCE_N;
/**
 * Helmet stopping distance for the stopping-distance model (mean E/d, peak × π/2 for the
 * half-sine): the d that gives the helmet spring's own peak at the EN 397 pass point,
 * d = (π/2)·E/F = (π/4) × the 19.6 mm stroke ≈ 15.4 mm. A soft item with no crush of its own then
 * meets the same helmet as a hard one does; the shorter distance errs towards more force.
 */
export const HELMET_STOPPING_DISTANCE_M = ((Math.PI / 2) * EN397_ENERGY_J) / EN397_FORCE_N;
/** Crush of a soft item itself (bag, glove, rubber, foam): 20 mm. Common practice, no source. */
export const SOFT_ITEM_CRUSH_M = 0.02;

/** A contact preset: what a hard or soft item meets on a bare head or a helmet. */
export interface ContactPreset {
  readonly id: string;
  readonly item: ItemHardness;
  readonly exposure: Exposure;
  /** Spring: duration from the item's mass; distance: fixed stopping distance. */
  readonly model: 'spring' | 'stopping-distance';
  readonly stiffnessNPerM?: number;
  readonly stoppingDistanceM?: number;
  readonly pulse: Pulse;
  readonly reasoning: string;
  readonly source: string;
}

export const CONTACT_PRESETS: readonly ContactPreset[] = [
  {
    id: 'hard-item-bare-head',
    item: 'hard',
    exposure: 'bare-head',
    model: 'spring',
    stiffnessNPerM: SKULL_STIFFNESS_N_PER_M,
    pulse: 'half-sine',
    reasoning:
      'A rigid item on a bare head is stopped by the skull itself. Treating the skull as a spring of 4 kN/mm ' +
      'gives Δt = (π/2)√(m/k): about 0.8 ms for 1 kg and 1.8 ms for 5 kg, a peak of v√(k m). The head is held ' +
      'fixed (its own mass would soften the blow), so the force errs high.',
    source: 'Yoganandan et al. 1995, Biomechanics of skull fracture, J Neurotrauma 12(4):659–668: dynamic stiffness mean 4023 N/mm (range 467–5867 N/mm)',
  },
  {
    id: 'hard-item-helmet',
    item: 'hard',
    exposure: 'helmet',
    model: 'spring',
    stiffnessNPerM: HELMET_STIFFNESS_N_PER_M,
    pulse: 'half-sine',
    reasoning:
      'A helmet that just passes EN 397 transmits 5.0 kN from 49.0 J (5 kg from 1 m). It is modelled as the linear ' +
      'spring through that point, k = F²/2E ≈ 255 N/mm (a 19.6 mm stroke there, a 7.0 ms half-sine for the 5 kg ' +
      'striker): the stiffest helmet EN 397 allows. Lighter items get shorter, sharper pulses. A helmet tested to ' +
      'ANSI/ISEA Z89.1 Type I (≤ 4,450 N at 54.45 J) must be softer, so for it the force errs high.',
    source: 'EN 397:2012+A1:2012 shock absorption (5 kg from 1 m, transmitted force ≤ 5.0 kN); not the ANSI/ISEA Z89.1-2014 Type I pass point (this spring gives its 3.6 kg striker at 5.5 m/s about 5.2 kN)',
  },
  {
    id: 'soft-item-bare-head',
    item: 'soft',
    exposure: 'bare-head',
    model: 'stopping-distance',
    stoppingDistanceM: SKULL_DEFLECTION_M + SOFT_ITEM_CRUSH_M,
    pulse: 'half-sine',
    reasoning:
      'A soft item (bag, glove, rubber, timber offcut end-grain aside) deforms on impact. Its stop is the skull ' +
      'deflection (5.8 mm) plus about 20 mm of crush of the item: 25.8 mm.',
    source: 'Skull deflection: Yoganandan et al. 1995 (dynamic mean 5.8 mm); item crush 20 mm: common practice, no source',
  },
  {
    id: 'soft-item-helmet',
    item: 'soft',
    exposure: 'helmet',
    model: 'stopping-distance',
    stoppingDistanceM: HELMET_STOPPING_DISTANCE_M + SOFT_ITEM_CRUSH_M,
    pulse: 'half-sine',
    reasoning:
      'A soft item on a helmet: the helmet stopping distance that gives the hard-item helmet spring its own peak at ' +
      'the EN 397 pass point ((π/2) × 49.0 J / 5.0 kN ≈ 15.4 mm) plus about 20 mm of crush of the item: 35.4 mm.',
    source: 'Helmet: EN 397:2012+A1:2012 pass point, as the hard-item helmet preset; item crush 20 mm: common practice, no source',
  },
];

/** The preset for an item hardness and exposure. */
export function contactPreset(item: ItemHardness, exposure: Exposure): ContactPreset {
  return CONTACT_PRESETS[(item === 'hard' ? 0 : 2) + (exposure === 'bare-head' ? 0 : 1)]!;
}

/** Contact duration in s of a mass (kg) stopped by a linear spring of stiffness k (N/m): (π/2)√(m/k). */
export function springContactDuration(mass: number, stiffness: number): number {
  return (Math.PI / 2) * Math.sqrt(mass / stiffness);
}

/**
 * Mean force in N of an item of mass m (kg) stopped from speed v (m/s) with energy E (J), from a
 * duration (s) and/or stopping distance (m); the larger when both are given.
 */
export function meanImpactForce(mass: number, speed: number, energy: number, durationS?: number, stoppingDistanceM?: number): number {
  const byDuration = durationS !== undefined ? (mass * speed) / durationS : 0;
  const byDistance = stoppingDistanceM !== undefined ? energy / stoppingDistanceM : 0;
  return byDuration > byDistance ? byDuration : byDistance;
}
