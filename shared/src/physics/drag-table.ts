/**
 * Handbook drag coefficients (subcritical Reynolds numbers, roughly 10⁴–10⁵, the range of hand-sized
 * items falling a few storeys), each with its source. Cd refers to the frontal area seen by the flow.
 * Values marked "recalled from memory" are standard textbook figures that were not re-checked against
 * the printed table for this release; check them against the edition in use before relying on them.
 */

/** One tabulated drag coefficient. `ratio` is the table's abscissa (see each table's description). */
export interface CdEntry {
  readonly ratio: number;
  readonly cd: number;
  readonly source: string;
}

/** A table of Cd against a dimensionless ratio, interpolated linearly, held flat beyond its ends. */
export interface CdTable {
  readonly id: string;
  readonly description: string;
  readonly ratioMeaning: string;
  readonly entries: readonly CdEntry[];
}

const MATTHEWS = 'Matthews, Aeronautical Engineer\'s Data Book (Butterworth-Heinemann), Fig. 5.13(b) "Drag coefficients for standard shapes"';
const WHITE = 'White, Fluid Mechanics, Table 7.3 "Drag of three-dimensional bodies at Re ≥ 10⁴"';

/** Smooth sphere below the drag crisis. */
export const SPHERE_CD: CdEntry = {
  ratio: 1,
  cd: 0.47,
  source: `Hoerner, Fluid-Dynamic Drag (1965), subcritical sphere; ${WHITE}: 0.47 (laminar boundary layer); NASA Glenn "Shape effects on drag" gives .07 to .5 by Reynolds number`,
};

/**
 * Flat plate normal to the flow by aspect ratio. Ratio = short side / long side (1 = square,
 * 0 = infinitely long strip), so the infinite case can be interpolated.
 */
export const PLATE_NORMAL_CD: CdTable = {
  id: 'plate-normal',
  description: 'Thin rectangular plate normal to the flow',
  ratioMeaning: 'short side / long side of the face',
  entries: [
    { ratio: 0, cd: 1.98, source: `${MATTHEWS}: long flat plate at 90° (2-D strip); ${WHITE}: 2.0` },
    { ratio: 1 / 20, cd: 1.5, source: `${WHITE}: plate b/h = 20 (recalled from memory)` },
    { ratio: 1 / 10, cd: 1.3, source: `${WHITE}: plate b/h = 10 (recalled from memory)` },
    { ratio: 1 / 5, cd: 1.2, source: `${WHITE}: plate b/h = 5 (recalled from memory)` },
    { ratio: 1, cd: 1.17, source: `Hoerner, Fluid-Dynamic Drag (1965), ch. 3: square plate normal to flow; ${MATTHEWS}: squared flat plate at 90°, 1.17` },
  ],
};

/**
 * Blunt square-faced prism face-on, by its depth along the flow. Ratio = depth / side of the face.
 * 0 is the square plate, 1 the cube; beyond the cube no square-prism data were at hand, so the
 * flat-faced cylinder in axial flow is used as the closest tabulated analogue (an assumption; the
 * lower values make the estimate faster, i.e. err on the side of more energy).
 */
export const PRISM_FACE_ON_CD: CdTable = {
  id: 'prism-face-on',
  description: 'Square-faced prism (plate, cube, bar end-on) with the flow normal to a face',
  ratioMeaning: 'depth along the flow / side of the face (√ of the face area for oblong faces)',
  entries: [
    { ratio: 0, cd: 1.17, source: 'Hoerner, Fluid-Dynamic Drag (1965), ch. 3: square plate normal to flow' },
    { ratio: 1, cd: 1.05, source: 'Hoerner, Fluid-Dynamic Drag (1965): cube face-on ≈ 1.05 (White, Fluid Mechanics, Table 7.3 gives 1.07)' },
    { ratio: 2, cd: 0.85, source: `Analogue: flat-faced cylinder in axial flow, l/d = 2 (${MATTHEWS})` },
    { ratio: 4, cd: 0.87, source: `Analogue: flat-faced cylinder in axial flow, l/d = 4 (${MATTHEWS})` },
    { ratio: 8, cd: 0.99, source: `Analogue: flat-faced cylinder in axial flow, l/d = 8 (${WHITE}, recalled from memory; ${MATTHEWS} lists 0.99 for its longest case)` },
  ],
};

/** Flat-faced circular cylinder with the flow along its axis (end-on). Ratio = length / diameter. */
export const CYLINDER_AXIAL_CD: CdTable = {
  id: 'cylinder-axial',
  description: 'Flat-faced circular cylinder, flow along the axis (end-on)',
  ratioMeaning: 'length / diameter',
  entries: [
    { ratio: 0, cd: 1.17, source: 'Hoerner, Fluid-Dynamic Drag (1965), ch. 3: circular disc normal to flow ≈ 1.17 (recalled from memory)' },
    { ratio: 0.5, cd: 1.15, source: `${WHITE}: cylinder l/d = 0.5 axial (recalled from memory)` },
    { ratio: 1, cd: 0.91, source: `${MATTHEWS}: cylinder, flow direction, l/d = 1 (White gives 0.90)` },
    { ratio: 2, cd: 0.85, source: `${MATTHEWS}: cylinder, flow direction, l/d = 2` },
    { ratio: 4, cd: 0.87, source: `${MATTHEWS}: cylinder, flow direction, l/d = 4` },
    { ratio: 8, cd: 0.99, source: `${WHITE}: cylinder l/d = 8 axial (recalled from memory; ${MATTHEWS} lists 0.99 for its longest case)` },
  ],
};

/**
 * Circular cylinder broadside (flow at right angles to the axis) by slenderness. Ratio =
 * diameter / length (1 = as long as wide, 0 = infinitely long), so the 2-D value can be interpolated.
 * Shorter cylinders than l/d = 1 keep the l/d = 1 value (no data; an extrapolation).
 */
export const CYLINDER_BROADSIDE_CD: CdTable = {
  id: 'cylinder-broadside',
  description: 'Circular cylinder broadside to the flow',
  ratioMeaning: 'diameter / length',
  entries: [
    { ratio: 0, cd: 1.2, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = ∞; ${WHITE}: 1.20` },
    { ratio: 1 / 40, cd: 0.98, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = 40` },
    { ratio: 1 / 20, cd: 0.91, source: `${WHITE}: finite cylinder broadside, l/d = 20 (recalled from memory)` },
    { ratio: 1 / 10, cd: 0.82, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = 10` },
    { ratio: 1 / 5, cd: 0.74, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = 5` },
    { ratio: 1 / 2, cd: 0.68, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = 2` },
    { ratio: 1, cd: 0.63, source: `${MATTHEWS}: cylinder at right angles to flow, l/d = 1 (White gives 0.64)` },
  ],
};

/**
 * Cube with an edge leading (turned 45° about an axis normal to the flow), Cd referred to the face
 * area a². Corner-first has no figure at hand; the edge-first value stands for it (an assumption).
 * Taken on the face area, the edge-first Cd·A (0.80 a²) is below the face-on one (1.05 a²): the
 * fastest way for a cube to fall; were it meant on the larger frontal area √2·a², edge-first would
 * be slower than face-on, so the face-area reading errs towards more energy.
 */
export const CUBE_EDGE_FIRST_CD: CdEntry = {
  ratio: 1,
  cd: 0.8,
  source: 'Hoerner, Fluid-Dynamic Drag (1965), ch. 3: cube with an edge forward ≈ 0.80 against 1.05 face forward (recalled from memory; the same pair appears in the widely reproduced chart of measured drag coefficients as "cube 1.05, angled cube 0.80")',
};

/** Every table, for the "how this was computed" screen and the documentation. */
export const CD_TABLES: readonly CdTable[] = [PLATE_NORMAL_CD, PRISM_FACE_ON_CD, CYLINDER_AXIAL_CD, CYLINDER_BROADSIDE_CD];

/** Linear interpolation in a table whose entries are sorted by ratio; flat beyond either end. */
export function interpolateCd(table: CdTable, ratio: number): number {
  const entries = table.entries;
  const first = entries[0]!;
  if (ratio <= first.ratio) return first.cd;
  for (let i = 1; i < entries.length; i++) {
    const right = entries[i]!;
    if (ratio <= right.ratio) {
      const left = entries[i - 1]!;
      return left.cd + ((right.cd - left.cd) * (ratio - left.ratio)) / (right.ratio - left.ratio);
    }
  }
  return entries[entries.length - 1]!.cd;
}
