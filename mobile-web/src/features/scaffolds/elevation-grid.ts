/**
 * The elevation drawing's geometry and what each bay of each lift holds. Pure, so the drawing and
 * its tap targets always agree and can be tested without a browser.
 */
import type { RiskBand } from '@plummet/shared';

/** Cell size, px: at least 48 px each way, so every bay of every lift is a thumb-sized target. */
export const CELL_WIDTH = 64;
export const CELL_HEIGHT = 64;
/** Room above the top lift for the standards' tops, and below the first lift for the base lift. */
export const TOP_MARGIN = 16;
export const BASE_HEIGHT = 40;
export const BAY_AXIS_HEIGHT = 28;

export interface GridSpot {
  elevation: string;
  lift: number;
  bay: number;
}

export interface CellSummary {
  lift: number;
  bay: number;
  count: number;
  /** The highest risk in the cell. */
  worstBand: RiskBand;
  worstScore: number;
}

export interface PinnedFinding {
  elevation: string;
  lift: number;
  bay: number;
  riskScore: number;
  riskBand: RiskBand;
}

export const cellKey = (lift: number, bay: number): string => `${lift}:${bay}`;

/** The findings of one elevation grouped by lift and bay, each cell showing its highest risk. */
export function summariseCells(findings: readonly PinnedFinding[], elevation: string): Map<string, CellSummary> {
  const cells = new Map<string, CellSummary>();
  for (const finding of findings) {
    if (finding.elevation !== elevation) continue;
    const key = cellKey(finding.lift, finding.bay);
    const cell = cells.get(key);
    if (!cell) {
      cells.set(key, { lift: finding.lift, bay: finding.bay, count: 1, worstBand: finding.riskBand, worstScore: finding.riskScore });
    } else {
      cell.count++;
      if (finding.riskScore > cell.worstScore) {
        cell.worstScore = finding.riskScore;
        cell.worstBand = finding.riskBand;
      }
    }
  }
  return cells;
}

export interface GridGeometry {
  width: number;
  height: number;
  /** y of the boards of lift n (1 = first lift above the base). */
  platformY(lift: number): number;
  /** x of the left standard of bay b (1-based). */
  bayX(bay: number): number;
  groundY: number;
}

/** Lift n is drawn standing on its boards; the top lift is at the top, the base lift at the bottom. */
export function gridGeometry(lifts: number, bays: number): GridGeometry {
  const platformY = (lift: number) => TOP_MARGIN + (lifts - lift + 1) * CELL_HEIGHT;
  const groundY = platformY(1) + BASE_HEIGHT;
  return {
    width: bays * CELL_WIDTH + 8,
    height: groundY + BAY_AXIS_HEIGHT,
    platformY,
    bayX: (bay: number) => 4 + (bay - 1) * CELL_WIDTH,
    groundY,
  };
}

/** Words for a cell's tap target, read by screen readers. */
export function describeCell(spot: GridSpot, cell: CellSummary | undefined): string {
  const where = `${spot.elevation}, lift ${spot.lift}, bay ${spot.bay}`;
  if (!cell) return `${where}: no findings`;
  return `${where}: ${cell.count} finding${cell.count === 1 ? '' : 's'}, highest ${cell.worstBand} risk ${cell.worstScore}`;
}
