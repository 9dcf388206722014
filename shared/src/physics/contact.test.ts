import { describe, expect, it } from 'vitest';
import { assessDrop } from './assess.js';
import { STANDARD_GRAVITY as G } from './constants.js';
import {
  CONTACT_PRESETS,
  contactPreset,
  HELMET_STIFFNESS_N_PER_M,
  HELMET_STOPPING_DISTANCE_M,
  meanImpactForce,
  PULSE_FACTORS,
  SKULL_STIFFNESS_N_PER_M,
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

  it('takes the skull stiffness of about 4 kN/mm and gives pulses under a few milliseconds for hard items', () => {
    expect(SKULL_STIFFNESS_N_PER_M).toBe(4_023_000); // Yoganandan et al. 1995: dynamic stiffness mean 4023 N/mm
    expect(springContactDuration(1, SKULL_STIFFNESS_N_PER_M) * 1000).toBeCloseTo(0.783, 3); // (π/2)√(1/4.023e6) s, spring quarter period
    expect(springContactDuration(5, SKULL_STIFFNESS_N_PER_M) * 1000).toBeCloseTo(1.751, 3); // same, 5 kg
  });

  it('reproduces the EN 397 helmet test point: 5 kg from 1 m, 5.0 kN, about 7 ms half-sine, about 10 mm', () => {
    expect(HELMET_STOPPING_DISTANCE_M * 1000).toBeCloseTo(9.81, 2); // EN 397: 49.03 J / 5.0 kN
    expect(HELMET_STIFFNESS_N_PER_M).toBeCloseTo(254_929, 0); // 5000² / (2 × 49.033) N/m, spring through the EN 397 limit
    const drop = assessDrop({ massKg: 5, heightM: 1, exposure: 'helmet' });
    expect(drop.resolved.contact.presetId).toBe('hard-item-helmet');
    expect(drop.resolved.contact.durationS! * 1000).toBeCloseTo(6.96, 2); // ≈ 7 ms: EN 397 impulse 22.1 N·s at 5.0 kN half-sine
    expect(drop.peakForceN).toBeCloseTo(5000, 6); // EN 397 transmitted-force limit, by construction of the preset
  });

  it('stops a soft item over the head or helmet deflection plus its own crush', () => {
    const soft = contactPreset('soft', 'bare-head');
    expect(soft.stoppingDistanceM).toBeCloseTo(0.0258, 12); // 5.8 mm skull deflection (Yoganandan 1995) + 20 mm crush (common practice, no source)
    const drop = assessDrop({ massKg: 2, heightM: 3, contact: { item: 'soft' } });
    expect(drop.meanForceN).toBeCloseTo(drop.impactEnergyJ / 0.0258, 6); // work–energy theorem
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
