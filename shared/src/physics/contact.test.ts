import { describe, expect, it } from 'vitest';
import { assessDrop } from './assess.js';
import { STANDARD_GRAVITY as G } from './constants.js';
import {
  CONTACT_PRESETS,
  contactPreset,
  EN397_ENERGY_J,
  HELMET_STIFFNESS_N_PER_M,
  HELMET_STOPPING_DISTANCE_M,
  HELMET_STROKE_AT_EN397_M,
  meanImpactForce,
  PULSE_FACTORS,
  SKULL_STIFFNESS_N_PER_M,
  SOFT_ITEM_CRUSH_M,
  springContactDuration,
} from './contact.js';

describe('impact forces', () => {
  it('takes the mean force from a contact time (m v / Δt) or a stopping distance (E / d)', () => {
    expect(meanImpactForce(2, 10, 100, 0.005)).toBeCloseTo(4000, 9); // impulse–momentum: 2 kg × 10 m/s / 5 ms
    expect(meanImpactForce(2, 10, 100, undefined, 0.02)).toBeCloseTo(5000, 9); // work–energy: 100 J / 20 mm
    expect(meanImpactForce(2, 10, 100, 0.005, 0.02)).toBeCloseTo(5000, 9); // both given: the larger (documented choice)
  });

  it('uses the peak-to-mean ratio of each pulse shape', () => {
    expect(PULSE_FACTORS.rectangular).toBe(1); // constant force: peak = mean
    expect(PULSE_FACTORS['half-sine']).toBeCloseTo(Math.PI / 2, 15); // mean of sin over a half period is 2/π
    expect(PULSE_FACTORS.triangular).toBe(2); // mean of a triangle is half its peak
    const drop = assessDrop({ massKg: 1, heightM: 5, contact: { durationS: 0.004, pulse: 'triangular' } });
    expect(drop.peakForceN).toBeCloseTo(2 * drop.meanForceN, 9); // triangular pulse: peak twice the mean
  });
});

describe('contact presets', () => {
  it('has a preset for hard and soft items on a bare head and a helmet, each with reasoning and source', () => {
    expect(CONTACT_PRESETS).toHaveLength(4);
    for (const preset of CONTACT_PRESETS) {
      expect(preset.reasoning.length).toBeGreaterThan(40);
      expect(preset.source.length).toBeGreaterThan(10);
      expect(contactPreset(preset.item, preset.exposure)).toBe(preset);
    }
  });

  it('gives hard items on a bare head pulses under a few milliseconds from the skull stiffness of about 4 kN/mm', () => {
    // Yoganandan et al. 1995, J Neurotrauma 12(4):659–668: dynamic skull stiffness, mean 4023 N/mm.
    expect(springContactDuration(1, 4_023_000) * 1000).toBeCloseTo(0.783, 3); // derivation: (π/2)√(1/4.023e6) s, a quarter period
    expect(springContactDuration(5, 4_023_000) * 1000).toBeCloseTo(1.751, 3); // same, 5 kg
    expect(contactPreset('hard', 'bare-head').stiffnessNPerM).toBe(4_023_000); // Yoganandan et al. 1995 mean
  });

  it('reproduces the EN 397 helmet test point: 5 kg from 1 m, 5.0 kN, a 19.6 mm stroke, about 7 ms', () => {
    expect(EN397_ENERGY_J).toBeCloseTo(49.03, 2); // EN 397:2012+A1:2012 shock test: 5 kg dropped 1 m, m g h with g = 9.80665
    expect(HELMET_STIFFNESS_N_PER_M / 1000).toBeCloseTo(254.9, 1); // derivation (docs/physics.md): k = F²/2E = 5000² / (2 × 49.03) N/m
    expect(HELMET_STROKE_AT_EN397_M * 1000).toBeCloseTo(19.6, 1); // derivation: largest spring deflection 2E/F = 2 × 49.03 / 5000
    const drop = assessDrop({ massKg: 5, heightM: 1, exposure: 'helmet' });
    expect(drop.resolved.contact.presetId).toBe('hard-item-helmet');
    expect(drop.resolved.contact.durationS! * 1000).toBeCloseTo(6.96, 2); // derivation: (π/2)√(5 / 254 929) s, a quarter period
    expect(drop.peakForceN).toBeCloseTo(5000, 6); // EN 397 transmitted-force limit 5.0 kN: the preset passes through it
  });

  it('does not claim ANSI/ISEA Z89.1 Type I: its striker gets more than the 4,450 N limit, so the preset errs high there', () => {
    // ANSI/ISEA Z89.1-2014 Type I force transmission: 3.6 kg striker dropped 1.524 m (5 ft), nominal 5.5 m/s, ≤ 4,450 N.
    const fromHeight = assessDrop({ massKg: 3.6, heightM: 1.524, exposure: 'helmet' });
    expect(fromHeight.impactVelocityMps).toBeCloseTo(5.467, 3); // √(2 × 9.80665 × 1.524), free fall from 5 ft
    expect(fromHeight.peakForceN / 1000).toBeCloseTo(5.24, 2); // v √(k m) with the EN 397 spring
    expect(fromHeight.peakForceN).toBeGreaterThan(4450); // above the Z89.1 limit: a Z89.1 helmet is softer than the preset
    expect(contactPreset('hard', 'helmet').source).toMatch(/not the ANSI\/ISEA Z89\.1/);
  });

  it('gives a soft item with no crush of its own the same helmet as a hard item at the EN 397 test point', () => {
    const soft = contactPreset('soft', 'helmet');
    expect(soft.stoppingDistanceM! - SOFT_ITEM_CRUSH_M).toBeCloseTo(HELMET_STOPPING_DISTANCE_M, 15);
    expect(HELMET_STOPPING_DISTANCE_M * 1000).toBeCloseTo(15.4, 1); // derivation: (π/2) × 49.03 J / 5.0 kN
    // Same striker, same helmet, stopping-distance model with the crush removed: the 5.0 kN EN 397 limit again.
    const noCrush = assessDrop({ massKg: 5, heightM: 1, exposure: 'helmet', contact: { stoppingDistanceM: HELMET_STOPPING_DISTANCE_M } });
    expect(noCrush.peakForceN).toBeCloseTo(5000, 6); // EN 397 transmitted-force limit
  });

  it('stops a soft item on a bare head over the skull deflection plus its own crush', () => {
    const soft = contactPreset('soft', 'bare-head');
    expect(soft.stoppingDistanceM! * 1000).toBeCloseTo(25.8, 12); // 5.8 mm skull deflection (Yoganandan et al. 1995) + 20 mm crush (common practice, no source)
    const drop = assessDrop({ massKg: 2, heightM: 3, contact: { item: 'soft' } });
    expect(drop.meanForceN).toBeCloseTo(drop.impactEnergyJ / 0.0258, 6); // work–energy theorem, F = E/d
    expect(drop.resolved.contact.presetId).toBe('soft-item-bare-head');
  });

  it('gives a hard item more force than a soft one, and a bare head more than a helmet', () => {
    const force = (item: 'hard' | 'soft', exposure: 'bare-head' | 'helmet') =>
      assessDrop({ massKg: 1, heightM: 6, contact: { item }, exposure }).peakForceN;
    expect(force('hard', 'bare-head')).toBeGreaterThan(force('hard', 'helmet'));
    expect(force('hard', 'helmet')).toBeGreaterThan(force('soft', 'helmet'));
    expect(force('soft', 'bare-head')).toBeGreaterThan(force('soft', 'helmet'));
  });

  it('peaks at v√(k m) for a spring stop with a half-sine pulse', () => {
    const drop = assessDrop({ massKg: 0.5, heightM: 4 });
    const v = Math.sqrt(2 * G * 4);
    expect(drop.peakForceN).toBeCloseTo(v * Math.sqrt(SKULL_STIFFNESS_N_PER_M * 0.5), 6); // linear spring: F_max = v √(k m)
  });
});
