import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CD_TABLES, CYLINDER_AXIAL_CD, CYLINDER_BROADSIDE_CD, interpolateCd, PLATE_NORMAL_CD, PRISM_FACE_ON_CD, SPHERE_CD } from './drag-table.js';
import { dragAreaFromShape, dragBreakdown } from './drag.js';
import type { Orientation, ShapeSpec } from './shape.js';

const entry = (table: typeof PLATE_NORMAL_CD, ratio: number) => table.entries.find((e) => e.ratio === ratio)!;

describe('Cd table', () => {
  it('holds each handbook value as cited', () => {
    expect(SPHERE_CD.cd).toBe(0.47); // Hoerner 1965; White, Fluid Mechanics Table 7.3 (laminar sphere)
    expect(entry(PLATE_NORMAL_CD, 1).cd).toBe(1.17); // Hoerner 1965 ch. 3 / Matthews Fig. 5.13(b): square plate normal to flow
    expect(entry(PLATE_NORMAL_CD, 0).cd).toBe(1.98); // Matthews Fig. 5.13(b): long flat plate at 90°
    expect(entry(PRISM_FACE_ON_CD, 1).cd).toBe(1.05); // Hoerner 1965: cube face-on ≈ 1.05
    expect(entry(CYLINDER_BROADSIDE_CD, 1 / 5).cd).toBe(0.74); // Matthews Fig. 5.13(b): cylinder broadside l/d = 5
    expect(entry(CYLINDER_BROADSIDE_CD, 1 / 10).cd).toBe(0.82); // Matthews Fig. 5.13(b): l/d = 10
    expect(entry(CYLINDER_BROADSIDE_CD, 0).cd).toBe(1.2); // Matthews Fig. 5.13(b) and White Table 7.3: l/d = ∞
    expect(entry(CYLINDER_AXIAL_CD, 2).cd).toBe(0.85); // Matthews Fig. 5.13(b): cylinder in axial flow, l/d = 2
  });

  it('carries a source beside every entry', () => {
    for (const table of CD_TABLES) {
      for (const e of table.entries) expect(e.source.length, `${table.id} @ ${e.ratio}`).toBeGreaterThan(10);
    }
    expect(SPHERE_CD.source).toMatch(/Hoerner/);
  });

  it('interpolates linearly between entries and holds flat beyond the ends', () => {
    expect(interpolateCd(CYLINDER_BROADSIDE_CD, 1 / 2)).toBe(0.68); // Matthews: l/d = 2, exact table point
    expect(interpolateCd(CYLINDER_BROADSIDE_CD, 3)).toBe(0.63); // shorter than l/d = 1 keeps the l/d = 1 value (documented extrapolation)
    expect(interpolateCd(PRISM_FACE_ON_CD, 0.5)).toBeCloseTo(1.11, 12); // midway between 1.17 and 1.05 (linear)
  });
});

describe('dragAreaFromShape', () => {
  it('gives a sphere 0.47 × π d²/4', () => {
    expect(dragAreaFromShape({ kind: 'sphere', diameterM: 0.1 })).toBeCloseTo(0.47 * Math.PI * 0.0025, 15); // Cd 0.47 (Hoerner) on the frontal area
  });

  it('gives a cube 1.05 × side² in every orientation', () => {
    for (const orientation of ['tumbling', 'flat', 'edge', 'worst'] as Orientation[]) {
      expect(dragAreaFromShape({ kind: 'box', lengthM: 0.2, widthM: 0.2, heightM: 0.2, orientation })).toBeCloseTo(1.05 * 0.04, 12); // Hoerner cube face-on
    }
  });

  it('gives a cylinder with l/d = 5 lying broadside Cd 0.74 on l·d', () => {
    const flat = dragBreakdown({ kind: 'cylinder', lengthM: 0.5, diameterM: 0.1, orientation: 'flat' });
    expect(flat.principal[0]!.name).toBe('broadside');
    expect(flat.principal[0]!.cd).toBeCloseTo(0.74, 12); // Matthews Fig. 5.13(b): l/d = 5 broadside
    expect(flat.dragAreaM2).toBeCloseTo(0.74 * 0.05, 12); // Cd 0.74 (Matthews) on l·d = 0.05 m²
  });

  it('averages a tumbling cylinder over its three principal axes (broadside twice, end-on once)', () => {
    const b = dragBreakdown({ kind: 'rod', lengthM: 0.5, diameterM: 0.1 });
    const side = 0.74 * 0.05; // Matthews: broadside l/d = 5
    const end = interpolateCd(CYLINDER_AXIAL_CD, 5) * (Math.PI / 4) * 0.01; // axial table at l/d = 5
    expect(b.orientation).toBe('tumbling');
    expect(b.dragAreaM2).toBeCloseTo((2 * side + end) / 3, 12);
  });

  it('lays a plate flat on its largest face with the plate Cd and falls end-first in the worst case', () => {
    const plate: ShapeSpec = { kind: 'plate', lengthM: 0.6, widthM: 0.6, thicknessM: 0.01 };
    const flat = dragBreakdown({ ...plate, orientation: 'flat' });
    expect(flat.principal[0]!.frontalAreaM2).toBeCloseTo(0.36, 12); // 0.6 m × 0.6 m face (geometry)
    expect(flat.principal[0]!.cd).toBeCloseTo(1.17 - 0.12 * (0.01 / 0.6), 12); // square plate 1.17 (Hoerner) less the depth correction towards the cube
    const worst = dragAreaFromShape({ ...plate, orientation: 'worst' });
    expect(worst).toBeLessThan(dragAreaFromShape({ ...plate, orientation: 'tumbling' }));
    expect(worst).toBeLessThan(0.1 * flat.dragAreaM2); // edge-on a thin plate shows little area
  });

  it('never makes the worst orientation slower than tumbling (lower or equal Cd·A)', () => {
    const size = fc.double({ min: 0.005, max: 3, noNaN: true });
    const shape: fc.Arbitrary<ShapeSpec> = fc.oneof(
      fc.record({ kind: fc.constant('box' as const), lengthM: size, widthM: size, heightM: size }),
      fc.record({ kind: fc.constant('plate' as const), lengthM: size, widthM: size, thicknessM: size }),
      fc.record({ kind: fc.constant('cylinder' as const), lengthM: size, diameterM: size }),
      fc.record({ kind: fc.constant('rod' as const), lengthM: size, diameterM: size }),
      fc.record({ kind: fc.constant('sphere' as const), diameterM: size }),
    );
    fc.assert(
      fc.property(shape, (s) => {
        const worst = dragAreaFromShape({ ...s, orientation: 'worst' });
        const tumbling = dragAreaFromShape({ ...s, orientation: 'tumbling' });
        const flat = dragAreaFromShape({ ...s, orientation: 'flat' });
        return worst <= tumbling * (1 + 1e-12) && worst <= flat * (1 + 1e-12) && worst > 0;
      }),
      { numRuns: 300 },
    );
  });
});

describe('dragAreaFromShape and dragBreakdown', () => {
  it('agree for every shape and orientation (the fast path builds no breakdown)', () => {
    const size = fc.double({ min: 0.001, max: 5, noNaN: true });
    const orientation = fc.constantFrom<Orientation | undefined>('tumbling', 'flat', 'edge', 'worst', undefined);
    const shape: fc.Arbitrary<ShapeSpec> = fc.oneof(
      fc.record({ kind: fc.constant('box' as const), lengthM: size, widthM: size, heightM: size, orientation }),
      fc.record({ kind: fc.constant('plate' as const), lengthM: size, widthM: size, thicknessM: size, orientation }),
      fc.record({ kind: fc.constant('cylinder' as const), lengthM: size, diameterM: size, orientation }),
      fc.record({ kind: fc.constant('rod' as const), lengthM: size, diameterM: size, orientation }),
      fc.record({ kind: fc.constant('sphere' as const), diameterM: size, orientation }),
    );
    fc.assert(
      fc.property(shape, (s) => {
        const fast = dragAreaFromShape(s);
        const detailed = dragBreakdown(s).dragAreaM2;
        return Math.abs(fast - detailed) <= 1e-14 * detailed;
      }),
      { numRuns: 300 },
    );
  });
});
