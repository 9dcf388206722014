import { liftPlatformHeightM } from '@plummet/shared';
import { useMemo } from 'react';
import { RiskBadge } from '../../../components/RiskBadge';
import { formatQuantity, type Units } from '../../../lib/units';
import {
  BAY_AXIS_HEIGHT,
  CELL_HEIGHT,
  CELL_WIDTH,
  cellKey,
  describeCell,
  gridGeometry,
  summariseCells,
  type GridSpot,
  type PinnedFinding,
} from '../elevation-grid';
import { ScaffoldDrawing } from './ScaffoldDrawing';
import '../../../components/RiskBadge.css';
import './ElevationGrid.css';

interface ElevationGridProps {
  elevation: string;
  lifts: number;
  bays: number;
  liftHeightM: number;
  /** One height per lift when they differ (empty or absent: all are liftHeightM). */
  liftHeightsM?: readonly number[] | null;
  findings: readonly PinnedFinding[];
  selected?: GridSpot;
  onSelect(spot: GridSpot): void;
  units: Units;
}

/**
 * One face of the scaffold as a drawing of its lifts and bays, with every bay of every lift a
 * button. Findings are pinned where they are, with the band in words on its colour.
 */
export function ElevationGrid({ elevation, lifts, bays, liftHeightM, liftHeightsM, findings, selected, onSelect, units }: ElevationGridProps) {
  const geometry = useMemo(() => gridGeometry(lifts, bays), [lifts, bays]);
  const cells = useMemo(() => summariseCells(findings, elevation), [findings, elevation]);
  const liftNumbers = Array.from({ length: lifts }, (_, i) => lifts - i);
  const bayNumbers = Array.from({ length: bays }, (_, i) => i + 1);

  return (
    <div className="elevation-grid" data-testid="elevation-grid" data-elevation={elevation}>
      <div className="elevation-grid__scroller">
        <div className="elevation-grid__lifts" style={{ height: geometry.height }} aria-hidden="true">
          {liftNumbers.map((lift) => (
            <div key={lift} className="elevation-grid__lift-label" style={{ top: geometry.platformY(lift) - CELL_HEIGHT, height: CELL_HEIGHT }}>
              <span className="elevation-grid__lift-number">Lift {lift}</span>
              <span className="elevation-grid__lift-height">{formatQuantity('height', liftPlatformHeightM({ lifts, liftHeightM, liftHeightsM }, lift), units)}</span>
            </div>
          ))}
          <div className="elevation-grid__lift-label elevation-grid__lift-label--ground" style={{ top: geometry.groundY - 12, height: BAY_AXIS_HEIGHT }}>
            Ground
          </div>
        </div>
        <div className="elevation-grid__face" style={{ width: geometry.width, height: geometry.height }}>
          <ScaffoldDrawing lifts={lifts} bays={bays} geometry={geometry} />
          {liftNumbers.map((lift) =>
            bayNumbers.map((bay) => {
              const cell = cells.get(cellKey(lift, bay));
              const spot = { elevation, lift, bay };
              const isSelected = selected?.elevation === elevation && selected.lift === lift && selected.bay === bay;
              return (
                <button
                  key={`${lift}:${bay}`}
                  type="button"
                  className={`grid-cell ${isSelected ? 'grid-cell--selected' : ''} ${cell ? 'grid-cell--pinned' : ''}`}
                  style={{ left: geometry.bayX(bay), top: geometry.platformY(lift) - CELL_HEIGHT, width: CELL_WIDTH, height: CELL_HEIGHT }}
                  aria-label={describeCell(spot, cell)}
                  aria-pressed={isSelected}
                  data-testid={`cell-${lift}-${bay}`}
                  data-count={cell?.count ?? 0}
                  onClick={() => onSelect(spot)}
                >
                  {cell && (
                    <span className="grid-cell__pin">
                      <RiskBadge band={cell.worstBand} compact />
                      {cell.count > 1 && <span className="grid-cell__count">{cell.count} items</span>}
                    </span>
                  )}
                </button>
              );
            }),
          )}
          {bayNumbers.map((bay) => (
            <span key={bay} className="elevation-grid__bay-label" style={{ left: geometry.bayX(bay), top: geometry.groundY + 4, width: CELL_WIDTH }} aria-hidden="true">
              {bay}
            </span>
          ))}
        </div>
      </div>
      <p className="elevation-grid__axis-note">
        Bays 1–{bays} from the left; heights are to each lift&rsquo;s boards. Tap a bay to see or add findings.
      </p>
    </div>
  );
}
