import { describe, expect, it } from 'vitest';
import { liftHeightsOf, liftPlatformHeightM, topPlatformHeightM } from './lift-heights.js';
import { liftHeightsMismatch, ScaffoldCreateSchema } from './scaffold.schema.js';

const uniform = { lifts: 4, liftHeightM: 2 };
const differing = { lifts: 3, liftHeightM: 2, liftHeightsM: [2.7, 2, 1.5] };

describe('lift heights', () => {
  it('puts every lift at the usual height when none are listed', () => {
    expect(liftHeightsOf(uniform)).toEqual([2, 2, 2, 2]);
    expect(liftPlatformHeightM(uniform, 3)).toBe(6);
    expect(topPlatformHeightM(uniform)).toBe(8);
    expect(liftPlatformHeightM({ ...uniform, liftHeightsM: null }, 2)).toBe(4);
  });

  it('adds up the lifts below a platform when their heights differ', () => {
    expect(liftHeightsOf(differing)).toEqual([2.7, 2, 1.5]);
    expect(liftPlatformHeightM(differing, 0)).toBe(0);
    expect(liftPlatformHeightM(differing, 1)).toBeCloseTo(2.7, 12);
    expect(liftPlatformHeightM(differing, 2)).toBeCloseTo(4.7, 12);
    expect(topPlatformHeightM(differing)).toBeCloseTo(6.2, 12);
  });

  it('counts a lift above the list at the usual height', () => {
    expect(liftPlatformHeightM(differing, 4)).toBeCloseTo(8.2, 12);
  });

  it('asks for one height per lift or none', () => {
    expect(liftHeightsMismatch(3, [])).toBeNull();
    expect(liftHeightsMismatch(3, [2, 2, 2])).toBeNull();
    expect(liftHeightsMismatch(3, [2, 2])).toBe('Give one height for each of the 3 lifts, or none to use the usual height for all');
    const parsed = ScaffoldCreateSchema.safeParse({
      siteId: '7d1f4c52-0000-4000-8000-000000000000',
      reference: 'A1',
      elevations: ['North'],
      lifts: 3,
      liftHeightM: 2,
      baysPerElevation: 4,
      liftHeightsM: [2, 2],
    });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues.map((i) => i.path.join('.'))).toEqual(['liftHeightsM']);
  });
});
