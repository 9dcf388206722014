/**
 * Drag area Cd·A of real items from their shape, dimensions and way of falling.
 *
 * Each shape has principal orientations (flow along each of its axes). A box or plate uses the
 * face-on prism table corrected for an oblong face by the plate aspect-ratio table
 * (Cd = Cd_prism(depth/√face) × Cd_plate(aspect)/Cd_plate(square); the product is an assumption);
 * cylinders and rods use the axial and broadside cylinder tables; a sphere has one value.
 */
import type { SquareMetres } from '../units/quantities.js';
import {
  CUBE_EDGE_FIRST_CD,
  CYLINDER_AXIAL_CD,
  CYLINDER_BROADSIDE_CD,
  interpolateCd,
  PLATE_NORMAL_CD,
  PRISM_FACE_ON_CD,
  SPHERE_CD,
} from './drag-table.js';
import type { Orientation, ShapeSpec } from './shape.js';

const SQUARE_PLATE_CD = interpolateCd(PLATE_NORMAL_CD, 1);
/**
 * Edge-first over face-on for a cube (0.80 / 1.05, Hoerner). For a box it scales the lowest face-on
 * Cd·A, an assumption beyond the cube that errs towards the faster fall.
 */
export const EDGE_FIRST_FACTOR = CUBE_EDGE_FIRST_CD.cd / interpolateCd(PRISM_FACE_ON_CD, 1);
const QUARTER_PI = Math.PI / 4;

/** Cd of a blunt prism face-on: face p × q (m), depth d (m) along the flow. */
export function prismFaceOnCd(p: number, q: number, depth: number): number {
  const long = p >= q ? p : q;
  const short = p >= q ? q : p;
  const depthRatio = depth / Math.sqrt(long * short);
  return (interpolateCd(PRISM_FACE_ON_CD, depthRatio) * interpolateCd(PLATE_NORMAL_CD, short / long)) / SQUARE_PLATE_CD;
}

/** Cd of a flat-faced cylinder end-on, length l and diameter d (m). */
export const cylinderAxialCd = (length: number, diameter: number): number =>
  interpolateCd(CYLINDER_AXIAL_CD, length / diameter);

/** Cd of a cylinder broadside, length l and diameter d (m). */
export const cylinderBroadsideCd = (length: number, diameter: number): number =>
  interpolateCd(CYLINDER_BROADSIDE_CD, diameter / length);

/** One principal orientation of an item: frontal area (m²), Cd and their product (m²). */
export interface OrientationDrag {
  readonly name: 'flat' | 'edge' | 'end' | 'edge-first' | 'broadside' | 'end-on' | 'any';
  readonly frontalAreaM2: number;
  readonly cd: number;
  readonly dragAreaM2: number;
  /** Share of this orientation in the tumbling mean (the principal axes it stands for, out of 3; 0 for edge-first). */
  readonly tumblingWeight: number;
  /** Which Cd table the value came from. */
  readonly cdTable: string;
}

/** How a drag area was obtained, for the "how this was computed" screen. */
export interface DragBreakdown {
  readonly orientation: Orientation;
  readonly dragAreaM2: SquareMetres;
  readonly principal: readonly OrientationDrag[];
  readonly method: string;
}

function boxOrientations(a0: number, b0: number, c0: number, withEdgeFirst: boolean): OrientationDrag[] {
  const [a, b, c] = [a0, b0, c0].sort((x, y) => y - x) as [number, number, number];
  const make = (name: OrientationDrag['name'], p: number, q: number, depth: number): OrientationDrag => {
    const cd = prismFaceOnCd(p, q, depth);
    return { name, frontalAreaM2: p * q, cd, dragAreaM2: cd * p * q, tumblingWeight: 1, cdTable: `${PRISM_FACE_ON_CD.id} × ${PLATE_NORMAL_CD.id}` };
  };
  const faces = [make('flat', a, b, c), make('edge', a, c, b), make('end', b, c, a)];
  if (!withEdgeFirst) return faces;
  const lowest = faces.reduce((x, y) => (y.dragAreaM2 < x.dragAreaM2 ? y : x));
  const edgeFirst: OrientationDrag = {
    name: 'edge-first',
    frontalAreaM2: lowest.frontalAreaM2,
    cd: lowest.cd * EDGE_FIRST_FACTOR,
    dragAreaM2: lowest.dragAreaM2 * EDGE_FIRST_FACTOR,
    tumblingWeight: 0,
    cdTable: `${lowest.cdTable} × cube edge-first / face-on`,
  };
  return [...faces, edgeFirst];
}

function cylinderOrientations(length: number, diameter: number): OrientationDrag[] {
  const sideArea = length * diameter;
  const endArea = QUARTER_PI * diameter * diameter;
  const sideCd = cylinderBroadsideCd(length, diameter);
  const endCd = cylinderAxialCd(length, diameter);
  const broadside: OrientationDrag = { name: 'broadside', frontalAreaM2: sideArea, cd: sideCd, dragAreaM2: sideCd * sideArea, tumblingWeight: 2, cdTable: CYLINDER_BROADSIDE_CD.id };
  const endOn: OrientationDrag = { name: 'end-on', frontalAreaM2: endArea, cd: endCd, dragAreaM2: endCd * endArea, tumblingWeight: 1, cdTable: CYLINDER_AXIAL_CD.id };
  return sideArea >= endArea ? [broadside, endOn] : [endOn, broadside];
}

function orientationsOf(shape: ShapeSpec): OrientationDrag[] {
  switch (shape.kind) {
    case 'box':
      return boxOrientations(shape.lengthM, shape.widthM, shape.heightM, true);
    case 'plate':
      return boxOrientations(shape.lengthM, shape.widthM, shape.thicknessM, false);
    case 'cylinder':
    case 'rod':
      return cylinderOrientations(shape.lengthM, shape.diameterM);
    case 'sphere': {
      const area = QUARTER_PI * shape.diameterM * shape.diameterM;
      return [{ name: 'any', frontalAreaM2: area, cd: SPHERE_CD.cd, dragAreaM2: SPHERE_CD.cd * area, tumblingWeight: 3, cdTable: 'sphere' }];
    }
  }
}

function pick(orientation: Orientation, list: readonly OrientationDrag[]): number {
  switch (orientation) {
    case 'flat':
      return list[0]!.dragAreaM2;
    case 'edge':
      return (list[1] ?? list[0]!).dragAreaM2;
    case 'worst':
      return Math.min(...list.map((o) => o.dragAreaM2));
    case 'tumbling': {
      let sum = 0;
      for (const o of list) sum += o.dragAreaM2 * o.tumblingWeight;
      return sum / 3;
    }
  }
}

const METHODS: Record<Orientation, string> = {
  tumbling: 'Tumbling: mean Cd·A over the three principal orientations (flow along each axis)',
  flat: 'Flat: largest frontal area normal to the fall',
  edge: 'Edge: the next principal orientation after flat (long edge leading; a cylinder on its rim or end-first)',
  worst: 'Fastest way: the lowest Cd·A of the principal orientations and, for a box, edge-first (Hoerner\'s cube ratio 0.80/1.05)',
};

/** Cd·A in m² with every principal orientation listed. Dimensions must be valid (see validateShape). */
export function dragBreakdown(shape: ShapeSpec): DragBreakdown {
  const orientation = shape.orientation ?? 'tumbling';
  const principal = orientationsOf(shape);
  return { orientation, dragAreaM2: pick(orientation, principal) as SquareMetres, principal, method: METHODS[orientation] };
}

/** Picks from the principal Cd·A values (m²) without building the breakdown. */
function choose(orientation: Orientation, first: number, second: number, third: number): number {
  switch (orientation) {
    case 'flat':
      return first;
    case 'edge':
      return second;
    case 'worst':
      return Math.min(first, second, third);
    case 'tumbling':
      // Boxes: the three faces once each; cylinders pass their broadside value twice.
      return (first + second + third) / 3;
  }
}

/**
 * Drag area Cd·A in m² of an item of the given shape, dimensions (m) and orientation (default
 * tumbling). Same values as dragBreakdown, computed without allocating (it runs for every estimate).
 */
export function dragAreaFromShape(shape: ShapeSpec): SquareMetres {
  const orientation = shape.orientation ?? 'tumbling';
  switch (shape.kind) {
    case 'sphere':
      return (SPHERE_CD.cd * QUARTER_PI * shape.diameterM * shape.diameterM) as SquareMetres;
    case 'box':
    case 'plate': {
      let a = shape.lengthM;
      let b = shape.widthM;
      let c = shape.kind === 'box' ? shape.heightM : shape.thicknessM;
      // Sort a ≥ b ≥ c.
      if (a < b) { const x = a; a = b; b = x; }
      if (b < c) { const x = b; b = c; c = x; }
      if (a < b) { const x = a; a = b; b = x; }
      const flat = prismFaceOnCd(a, b, c) * a * b;
      const edge = prismFaceOnCd(a, c, b) * a * c;
      const end = prismFaceOnCd(b, c, a) * b * c;
      if (orientation === 'worst' && shape.kind === 'box') return (Math.min(flat, edge, end) * EDGE_FIRST_FACTOR) as SquareMetres;
      return choose(orientation, flat, edge, end) as SquareMetres;
    }
    case 'cylinder':
    case 'rod': {
      const l = shape.lengthM;
      const d = shape.diameterM;
      const sideArea = l * d;
      const endArea = QUARTER_PI * d * d;
      const side = cylinderBroadsideCd(l, d) * sideArea;
      const end = cylinderAxialCd(l, d) * endArea;
      // Principal axes: broadside twice, end-on once.
      return (sideArea >= endArea ? choose(orientation, side, end, side) : choose(orientation, end, side, side)) as SquareMetres;
    }
  }
}
