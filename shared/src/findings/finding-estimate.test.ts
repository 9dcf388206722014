import { describe, expect, it } from 'vitest';
import { assessDrop } from '../physics/assess.js';
import { estimateFinding } from './finding-estimate.js';

const loose = { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'occasional' } as const;

describe('estimateFinding', () => {
  it('gives 1 kg from 20 m with no shape the vacuum energy m g h = 196.1 J (standard gravity 9.80665 m/s²)', () => {
    const r = estimateFinding({ massKg: 1, heightM: 20, shape: null, exposure: 'public', likelihoodAnswers: loose });
    expect(r.estimate.impactEnergyJ).toBeCloseTo(1 * 9.80665 * 20, 6);
    expect(r.estimate.terminalVelocityMps).toBeNull();
  });

  it('uses the shared physics for the drop and rates a hard hat below as a helmet', () => {
    const shape = { kind: 'box', lengthM: 0.215, widthM: 0.1025, heightM: 0.065 } as const;
    const r = estimateFinding({ massKg: 2.7, heightM: 12, shape, exposure: 'hard-hats', likelihoodAnswers: loose });
    const direct = assessDrop({ massKg: 2.7, heightM: 12, shape, exposure: 'helmet' });
    expect(r.estimate.impactEnergyJ).toBe(direct.impactEnergyJ);
    expect(r.severity).toBe(direct.severity.level);
  });

  it('multiplies severity by likelihood into the risk score and band', () => {
    const r = estimateFinding({ massKg: 2.7, heightM: 12, shape: null, exposure: 'public', likelihoodAnswers: loose });
    expect(r.riskScore).toBe(r.severity * r.likelihood);
    expect(['Low', 'Medium', 'High']).toContain(r.riskBand);
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
