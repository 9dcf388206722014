import { describe, expect, it } from 'vitest';
import { estimateFinding } from './finding-estimate.js';

const loose = { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'occasional' } as const;

describe('estimateFinding', () => {
  it('gives 1 kg from 20 m with no shape the vacuum energy m g h = 196.1 J (standard gravity 9.80665 m/s²)', () => {
    const r = estimateFinding({ massKg: 1, heightM: 20, shape: null, exposure: 'public', likelihoodAnswers: loose });
    expect(r.estimate.impactEnergyJ).toBeCloseTo(196.133, 6); // 1 kg × 9.80665 m/s² (standard gravity, 3rd CGPM 1901) × 20 m
    expect(r.estimate.terminalVelocityMps).toBeNull();
    expect(Object.keys(r.estimate.severity)).toEqual(['level', 'label', 'basis']); // plain own data, as IndexedDB's structured clone keeps it
    expect(Object.getPrototypeOf(r.estimate.severity)).toBe(Object.prototype);
  });

  it('rates a hard hat below as a helmet: the EN 397 striker (5 kg from 1 m) is Catastrophic on a bare head and Major in a helmet', () => {
    // 5 kg from 1 m, no drag: 49.03 J (EN 397:2012+A1:2012 shock test energy).
    const bare = estimateFinding({ massKg: 5, heightM: 1, shape: null, exposure: 'public', likelihoodAnswers: loose });
    const helmet = estimateFinding({ massKg: 5, heightM: 1, shape: null, exposure: 'hard-hats', likelihoodAnswers: loose });
    expect(bare.severity).toBe(5); // peak v √(k m) on the 4023 N/mm skull spring ≈ 19.9 kN ≥ 14.1 kN, highest skull-fracture force (Yoganandan et al. 1995)
    expect(helmet.severity).toBe(4); // peak 5.0 kN, the EN 397 transmitted-force limit, on the helmet spring through that limit
  });

  it('multiplies severity by likelihood into the risk score and band of the product brief', () => {
    // 2.7 kg from 12 m, no drag, bare head: 317.8 J, far above 68.5 J (Yoganandan et al. 1995): severity 5.
    // Loose, at the edge, light work, calm, occasional passers: 1 + 2 + 1 = 4 (rules as data, common practice, no source).
    const r = estimateFinding({ massKg: 2.7, heightM: 12, shape: null, exposure: 'public', likelihoodAnswers: loose });
    expect([r.severity, r.likelihood, r.riskScore, r.riskBand]).toEqual([5, 4, 20, 'High']); // 5 × 4 = 20: High 12–25 (product brief)
  });

  it('carries both impacts of an item in wind, the faster governing', () => {
    const shape = { kind: 'plate', lengthM: 0.6, widthM: 0.3, thicknessM: 0.012 } as const;
    const r = estimateFinding({ massKg: 0.2, heightM: 30, shape, exposure: 'public', likelihoodAnswers: loose, windSpeedMps: 20 });
    expect(r.estimate.governingImpact).toBe('wind');
    expect(r.estimate.windImpactVelocityMps).toBeCloseTo(21, 0); // worked example: about 21 m/s over the ground
    expect(r.estimate.stillAirImpactVelocityMps).toBeLessThan(r.estimate.windImpactVelocityMps);
    expect(r.severity).toBe(5);
  });

  it('rates a closed zone as a bare head, the worst case, and leaves the lower likelihood to the answers', () => {
    const answers = { ...loose, footTraffic: 'none' } as const;
    const closed = estimateFinding({ massKg: 0.7, heightM: 10, shape: null, exposure: 'zone-closed', likelihoodAnswers: answers });
    const pub = estimateFinding({ massKg: 0.7, heightM: 10, shape: null, exposure: 'public', likelihoodAnswers: answers });
    expect(closed.severity).toBe(pub.severity);
    expect(closed.likelihood).toBe(1);
  });

  it('carries the inspection wind into the drift of an item with drag, and none without wind', () => {
    const shape = { kind: 'plate', lengthM: 1, widthM: 0.225, thicknessM: 0.038 } as const;
    const windy = estimateFinding({ massKg: 5.1, heightM: 20, shape, exposure: 'public', likelihoodAnswers: loose, windSpeedMps: 8 });
    const still = estimateFinding({ massKg: 5.1, heightM: 20, shape, exposure: 'public', likelihoodAnswers: loose, windSpeedMps: null });
    expect(windy.estimate.driftM).toBeGreaterThan(0);
    expect(still.estimate.driftM).toBe(0);
  });
});
