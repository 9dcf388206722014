/**
 * Shapes an inspector can describe, with their dimensions in metres.
 *
 * Orientation while falling:
 * - `tumbling` (default): the mean Cd·A over the three principal orientations (flow along each axis);
 * - `flat`: the largest face (or the largest frontal area) normal to the fall;
 * - `edge`: a box or plate on its long edge (the middle-sized face leads); a cylinder or rod in its
 *   other principal orientation (on its rim when disc-like, end-first when long);
 * - `worst`: the fastest way down: the lowest-drag principal orientation and, for a box, edge-first
 *   (a cube falling edge- or corner-first has less drag than face-on; see CUBE_EDGE_FIRST_CD).
 */
export type Orientation = 'tumbling' | 'flat' | 'edge' | 'worst';

export const ORIENTATIONS: readonly Orientation[] = ['tumbling', 'flat', 'edge', 'worst'];

/** A rectangular block (brick, fitting box, toolbox); any order of dimensions, metres. */
export interface BoxShape {
  kind: 'box';
  lengthM: number;
  widthM: number;
  heightM: number;
  orientation?: Orientation;
}

/** A thin rectangular item (board offcut, sheet, tile); metres. */
export interface PlateShape {
  kind: 'plate';
  lengthM: number;
  widthM: number;
  thicknessM: number;
  orientation?: Orientation;
}

/** A short round item (coupler body, can, reel); metres. */
export interface CylinderShape {
  kind: 'cylinder';
  lengthM: number;
  diameterM: number;
  orientation?: Orientation;
}

/** A long round item (scaffold tube, bar, rebar, pin); same drag model as the cylinder. Metres. */
export interface RodShape {
  kind: 'rod';
  lengthM: number;
  diameterM: number;
  orientation?: Orientation;
}

/** A ball or round lump; orientation does not matter. Metres. */
export interface SphereShape {
  kind: 'sphere';
  diameterM: number;
  orientation?: Orientation;
}

/** Shape of an item, with dimensions in metres and how it falls. */
export type ShapeSpec = BoxShape | PlateShape | CylinderShape | RodShape | SphereShape;

export type ShapeKind = ShapeSpec['kind'];

export const SHAPE_KINDS: readonly ShapeKind[] = ['box', 'plate', 'cylinder', 'rod', 'sphere'];

/** The dimension fields each shape needs (all metres, > 0). */
export const SHAPE_DIMENSIONS: Readonly<Record<ShapeKind, readonly string[]>> = {
  box: ['lengthM', 'widthM', 'heightM'],
  plate: ['lengthM', 'widthM', 'thicknessM'],
  cylinder: ['lengthM', 'diameterM'],
  rod: ['lengthM', 'diameterM'],
  sphere: ['diameterM'],
};
