import { describe, expect, it } from 'vitest';
import { assessDrop } from '../physics/assess.js';
import { BOUNCE_ALLOWANCE_M, suggestExclusionZone } from './exclusion-zone.js';

const brick = { name: 'Brick', massKg: 2.5, shape: { kind: 'box' as const, lengthM: 0.215, widthM: 0.1025, heightM: 0.065 } };

describe('exclusion zone suggestion', () => {
  it('is the drift at the limiting wind (the shared drift integration) plus the bounce allowance (common practice, no source)', () => {
    const zone = suggestExclusionZone({ topWorkingHeightM: 20, item: brick, limitingWindMps: 18 });
    const drift = assessDrop({ massKg: 2.5, heightM: 20, shape: brick.shape, windSpeedMps: 18 }).driftM;
    expect(zone.driftM).toBeCloseTo(drift, 12);
    expect(zone.bounceAllowanceM).toBe(BOUNCE_ALLOWANCE_M);
    expect(zone.suggestedWidthM).toBeCloseTo(drift + 2, 12);
    expect(zone.driftM).toBeGreaterThan(0);
    expect(zone.caution).toMatch(/competent person/);
  });

  it('shows IBC 2021 Table 3306.1 widths at a quarter and half of the height (from memory) and UK WAHR 2005 reg. 11', () => {
    const zone = suggestExclusionZone({ topWorkingHeightM: 20, item: brick, limitingWindMps: 18 });
    expect(zone.rulesOfThumb.map((r) => r.widthM)).toEqual([5, 10, null]);
    expect(zone.rulesOfThumb[0].source).toContain('IBC 2021 Table 3306.1');
    expect(zone.rulesOfThumb[2].source).toContain('UK WAHR 2005 reg. 11');
  });

  it('grows with height and wind, and is the bounce allowance alone in still air', () => {
    const calm = suggestExclusionZone({ topWorkingHeightM: 20, item: brick, limitingWindMps: 0 });
    expect(calm.suggestedWidthM).toBe(BOUNCE_ALLOWANCE_M);
    const low = suggestExclusionZone({ topWorkingHeightM: 10, item: brick, limitingWindMps: 15 });
    const high = suggestExclusionZone({ topWorkingHeightM: 30, item: brick, limitingWindMps: 15 });
    const windy = suggestExclusionZone({ topWorkingHeightM: 10, item: brick, limitingWindMps: 25 });
    expect(high.suggestedWidthM).toBeGreaterThan(low.suggestedWidthM);
    expect(windy.suggestedWidthM).toBeGreaterThan(low.suggestedWidthM);
  });
});
