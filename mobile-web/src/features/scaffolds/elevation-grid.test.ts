import { describe, expect, it } from 'vitest';
import { CELL_HEIGHT, cellKey, describeCell, gridGeometry, summariseCells } from './elevation-grid';

const pins = [
  { elevation: 'North', lift: 5, bay: 4, riskScore: 8, riskBand: 'Medium' as const },
  { elevation: 'North', lift: 5, bay: 4, riskScore: 16, riskBand: 'High' as const },
  { elevation: 'North', lift: 1, bay: 1, riskScore: 2, riskBand: 'Low' as const },
  { elevation: 'East', lift: 5, bay: 4, riskScore: 20, riskBand: 'High' as const },
];

describe('the elevation grid', () => {
  it('pins each elevation’s findings to their cell with the highest risk shown', () => {
    const cells = summariseCells(pins, 'North');
    expect(cells.size).toBe(2);
    expect(cells.get(cellKey(5, 4))).toEqual({ lift: 5, bay: 4, count: 2, worstBand: 'High', worstScore: 16 });
    expect(cells.get(cellKey(1, 1))?.worstBand).toBe('Low');
  });

  it('draws the top lift at the top and each lift one cell above the one below', () => {
    const geometry = gridGeometry(6, 12);
    expect(geometry.platformY(6)).toBeLessThan(geometry.platformY(1));
    expect(geometry.platformY(1) - geometry.platformY(2)).toBe(CELL_HEIGHT);
    expect(geometry.groundY).toBeGreaterThan(geometry.platformY(1));
    expect(geometry.bayX(2) - geometry.bayX(1)).toBeGreaterThanOrEqual(48);
  });

  it('describes a cell in words for screen readers', () => {
    const cells = summariseCells(pins, 'North');
    expect(describeCell({ elevation: 'North', lift: 5, bay: 4 }, cells.get('5:4'))).toBe('North, lift 5, bay 4: 2 findings, highest High risk 16');
    expect(describeCell({ elevation: 'North', lift: 2, bay: 2 }, undefined)).toBe('North, lift 2, bay 2: no findings');
  });
});
