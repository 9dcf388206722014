/** The zod form of the shared physics' ShapeSpec: an item's shape, dimensions in metres (0 < d ≤ 25 m). */
import { z } from 'zod';
import { LIMITS } from '../common/fields.schema.js';
import type { ShapeSpec } from '../physics/shape.js';

const dimension = z.number().positive().max(LIMITS.dimensionMaxM);
const orientation = z.enum(['tumbling', 'flat', 'edge', 'worst']).optional();

export const ShapeSpecSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('box'), lengthM: dimension, widthM: dimension, heightM: dimension, orientation }),
  z.object({ kind: z.literal('plate'), lengthM: dimension, widthM: dimension, thicknessM: dimension, orientation }),
  z.object({ kind: z.literal('cylinder'), lengthM: dimension, diameterM: dimension, orientation }),
  z.object({ kind: z.literal('rod'), lengthM: dimension, diameterM: dimension, orientation }),
  z.object({ kind: z.literal('sphere'), diameterM: dimension, orientation }),
]);

// The schema and the physics type must describe the same thing: this fails to compile when they drift.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const shapesAgree: Same<z.infer<typeof ShapeSpecSchema>, ShapeSpec> = true;
void shapesAgree;
