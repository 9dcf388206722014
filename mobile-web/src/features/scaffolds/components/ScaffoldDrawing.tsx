import { memo } from 'react';
import { CELL_HEIGHT, CELL_WIDTH, TOP_MARGIN, type GridGeometry } from '../elevation-grid';

interface ScaffoldDrawingProps {
  lifts: number;
  bays: number;
  geometry: GridGeometry;
}

/**
 * Plummet's own line drawing of a tube scaffold face: standards, ledgers, guard rails, brass
 * boards with toe boards, a brace every few bays and base plates on the ground. Decorative: the
 * buttons over it carry the meaning.
 */
export const ScaffoldDrawing = memo(function ScaffoldDrawing({ lifts, bays, geometry }: ScaffoldDrawingProps) {
  const { width, height, platformY, bayX, groundY } = geometry;
  const left = bayX(1);
  const right = bayX(bays) + CELL_WIDTH;
  const standards = Array.from({ length: bays + 1 }, (_, i) => left + i * CELL_WIDTH);
  const liftNumbers = Array.from({ length: lifts }, (_, i) => i + 1);

  return (
    <svg className="scaffold-drawing" width={width} height={height} viewBox={`0 0 ${width} ${height}`} aria-hidden="true" focusable="false">
      <defs>
        <pattern id="ground-hatch" width="8" height="8" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="8" stroke="#8d8597" strokeWidth="2" />
        </pattern>
      </defs>
      <rect x={0} y={groundY} width={width} height={10} fill="url(#ground-hatch)" />
      <line x1={0} y1={groundY} x2={width} y2={groundY} stroke="#4a4452" strokeWidth={2} />

      {liftNumbers.map((lift) => {
        const y = platformY(lift);
        const railY = y - CELL_HEIGHT * 0.48;
        return (
          <g key={lift}>
            <line x1={left} y1={railY} x2={right} y2={railY} stroke="#8d8597" strokeWidth={2} />
            <line x1={left} y1={y} x2={right} y2={y} stroke="#6e6877" strokeWidth={2} />
            <rect x={left} y={y - 6} width={right - left} height={6} fill="#e0a030" />
            <rect x={left} y={y - 10} width={right - left} height={4} fill="#a8741c" />
          </g>
        );
      })}

      {liftNumbers.map((lift) =>
        standards.slice(0, -1).map((x, index) =>
          index % 5 === 0 ? (
            <line key={`${lift}-${x}`} x1={x} y1={lift === 1 ? groundY : platformY(lift - 1)} x2={x + CELL_WIDTH} y2={platformY(lift)} stroke="#b9b2c2" strokeWidth={2} />
          ) : null,
        ),
      )}

      {standards.map((x) => (
        <g key={x}>
          <line x1={x} y1={TOP_MARGIN - 8} x2={x} y2={groundY} stroke="#5b2a86" strokeWidth={4} strokeLinecap="round" />
          <rect x={x - 8} y={groundY - 3} width={16} height={4} fill="#4a1d6b" />
        </g>
      ))}
    </svg>
  );
});
