import { describe, expect, it } from 'vitest';
import { describeChange, whatIfs } from './what-if';

const brickAtTheEdge = {
  massKg: 2.3,
  heightM: 12,
  shape: { kind: 'box' as const, lengthM: 0.215, widthM: 0.1025, heightM: 0.065 },
  exposure: 'public' as const,
  likelihoodAnswers: { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' } as const,
  windSpeedMps: null,
};

describe('what-ifs', () => {
  const scenarios = whatIfs(brickAtTheEdge, 10, 'Lowered by 10 m');
  const byId = Object.fromEntries(scenarios.map((s) => [s.id, s]));

  it('tethering and moving back lower the likelihood but not the energy', () => {
    const now = byId.now!.result!;
    for (const id of ['tethered', 'moved-back']) {
      const result = byId[id]!.result!;
      expect(result.likelihood).toBeLessThan(now.likelihood);
      expect(result.estimate.impactEnergyJ).toBe(now.estimate.impactEnergyJ);
      expect(result.riskScore).toBeLessThan(now.riskScore);
    }
  });

  it('lowering the item lowers the energy of the fall', () => {
    expect(byId.lowered!.input.heightM).toBeCloseTo(2, 12);
    expect(byId.lowered!.result!.estimate.impactEnergyJ).toBeLessThan(byId.now!.result!.estimate.impactEnergyJ);
    expect(byId.all!.result!.riskScore).toBeLessThanOrEqual(Math.min(...scenarios.map((s) => s.result!.riskScore)));
  });

  it('never lowers below the floor, and words the change', () => {
    expect(whatIfs(brickAtTheEdge, 50, 'x')[3]!.input.heightM).toBe(0.1);
    expect(describeChange(byId.now!.result, byId.now!.result)).toBe('No change in risk score');
    expect(describeChange(byId.now!.result, byId.all!.result)).toMatch(/^Lower by \d+/);
  });
});
