import { SHAPE_DIMENSIONS, type FindingExposure, type Orientation, type ShapeSpec } from '@plummet/shared';
import { formatNumber, toDisplay, unitLabel, type Units } from '../../lib/units';
import type { ShapeChoice } from './finding-form';

export const EXPOSURE_WORDS: Record<FindingExposure, { label: string; hint: string }> = {
  public: { label: 'Public, no head protection', hint: 'Pavement, entrance, neighbours' },
  'hard-hats': { label: 'Workers in hard hats', hint: 'Site operatives with helmets' },
  'zone-closed': { label: 'Nobody: zone closed', hint: 'Barriers keep everyone out below' },
};

export const SHAPE_WORDS: Record<ShapeChoice, string> = {
  box: 'Block',
  plate: 'Flat sheet',
  cylinder: 'Short round',
  rod: 'Long round',
  sphere: 'Ball',
  unknown: 'Not known',
};

export const DIMENSION_WORDS: Record<string, string> = {
  lengthM: 'Length',
  widthM: 'Width',
  heightM: 'Height',
  thicknessM: 'Thickness',
  diameterM: 'Diameter',
};

export const ORIENTATION_WORDS: Record<Orientation, { label: string; hint: string }> = {
  tumbling: { label: 'Tumbling', hint: 'The usual case: the average of every way up' },
  flat: { label: 'Flat', hint: 'Largest face down, the slowest fall' },
  edge: { label: 'On edge', hint: 'Edge or end first' },
  worst: { label: 'Fastest way', hint: 'The least air drag: the worst case' },
};

/** "Block, 33 × 11 × 3.5 cm" in the user's units; "shape not known (no air drag)" for none. */
export function describeShape(shape: ShapeSpec | null, units: Units): string {
  if (!shape) return 'shape not known (no air drag, the worst case)';
  const sizes = SHAPE_DIMENSIONS[shape.kind].map((field) => formatNumber(toDisplay('size', (shape as unknown as Record<string, number>)[field] ?? 0, units)));
  return `${SHAPE_WORDS[shape.kind]}, ${sizes.join(' × ')} ${unitLabel('size', units)}`;
}
