import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessDrop } from './assess.js';
import type { DropInput } from './drop.types.js';
import { PULSES } from './contact.js';
import { ORIENTATIONS, type ShapeSpec } from './shape.js';
import { DropInputError, firstDropInputIssue, validateDropInput } from './validation.js';

const valid: DropInput = { massKg: 1, heightM: 5 };

const rejects = (input: unknown, field: string, code: string) =>
  expect(() => assessDrop(input as DropInput)).toThrow(expect.objectContaining({ name: 'DropInputError', field, code }));

describe('drop input validation', () => {
  it('throws a typed error naming the field for each kind of bad value', () => {
    rejects({ heightM: 5 }, 'massKg', 'required');
    rejects({ massKg: 0, heightM: 5 }, 'massKg', 'not-positive');
    rejects({ massKg: -1, heightM: 5 }, 'massKg', 'not-positive');
    rejects({ massKg: NaN, heightM: 5 }, 'massKg', 'not-a-number');
    rejects({ massKg: '2', heightM: 5 }, 'massKg', 'not-a-number');
    rejects({ massKg: 1, heightM: Infinity }, 'heightM', 'not-finite');
    rejects({ massKg: 1, heightM: 0 }, 'heightM', 'not-positive');
    rejects({ ...valid, dragAreaM2: -0.01 }, 'dragAreaM2', 'negative');
    rejects({ ...valid, initialVelocityMps: -Infinity }, 'initialVelocityMps', 'not-finite');
    rejects({ ...valid, airDensityKgM3: 0 }, 'airDensityKgM3', 'not-positive');
    rejects({ ...valid, gravityMps2: -9.8 }, 'gravityMps2', 'not-positive');
    rejects({ ...valid, windSpeedMps: -3 }, 'windSpeedMps', 'negative');
    rejects({ ...valid, exposure: 'hard-hat' }, 'exposure', 'not-an-option');
    rejects({ ...valid, contact: { durationS: 0 } }, 'contact.durationS', 'not-positive');
    rejects({ ...valid, contact: { stoppingDistanceM: -0.01 } }, 'contact.stoppingDistanceM', 'not-positive');
    rejects({ ...valid, contact: { pulse: 'square' } }, 'contact.pulse', 'not-an-option');
    rejects({ ...valid, shape: { kind: 'cone', diameterM: 1 } }, 'shape.kind', 'not-an-option');
    rejects({ ...valid, shape: { kind: 'box', lengthM: 1, widthM: 1 } }, 'shape.heightM', 'required');
    rejects({ ...valid, shape: { kind: 'rod', lengthM: 1, diameterM: 0 } }, 'shape.diameterM', 'not-positive');
    rejects({ ...valid, shape: { kind: 'sphere', diameterM: 0.1, orientation: 'sideways' } }, 'shape.orientation', 'not-an-option');
    rejects(null, 'input', 'not-an-object');
  });

  it('lists every issue for a form, and none for a valid input', () => {
    const issues = validateDropInput({ massKg: -1, heightM: 'high', windSpeedMps: -2 });
    expect(issues.map((i) => i.field)).toEqual(['massKg', 'heightM', 'windSpeedMps']);
    expect(issues[0]!.message).toMatch(/massKg must be greater than zero/);
    expect(validateDropInput({ ...valid, shape: { kind: 'plate', lengthM: 1, widthM: 0.5, thicknessM: 0.01 } })).toEqual([]);
    expect(firstDropInputIssue(valid)).toBeUndefined();
  });

  it('carries every issue on the thrown error', () => {
    try {
      assessDrop({ massKg: 0, heightM: -1 });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(DropInputError);
      expect((error as DropInputError).issues).toHaveLength(2);
    }
  });

  it('treats null optional fields as absent (forms and JSON send null)', () => {
    const drop = assessDrop({ ...valid, dragAreaM2: null, windSpeedMps: null, contact: null } as unknown as DropInput);
    expect(drop.resolved.dragAreaSource).toBe('none');
    expect(drop.resolved.defaultsApplied).toContain('windSpeedMps');
  });

  it('gives finite numbers in every field for valid inputs, with a stated share reaching the drift integrator', () => {
    let runs = 0;
    let drifted = 0;
    fc.assert(
      fc.property(validDropInput, (input) => {
        const d = assessDrop(input);
        runs++;
        if (d.driftM > 0) drifted++;
        for (const [field, value] of numericFields(d)) {
          if (field === 'terminalVelocityMps' && d.resolved.dragAreaM2 === 0) expect(value).toBe(Infinity); // no drag: no terminal speed
          else expect(Number.isFinite(value), `${field} = ${value}`).toBe(true);
        }
        expect(d.impactVelocityMps).toBe(Math.max(d.stillAirImpactVelocityMps, d.windImpactVelocityMps));
      }),
      { numRuns: 500 },
    );
    // Half the inputs carry wind and about nine in ten of those have drag: at least a third must drift.
    expect(drifted / runs).toBeGreaterThan(1 / 3);
  }, 20_000); // 500 estimates, half of them integrating the drift: slow on a busy machine

  it('rejects every input with one bad field by a DropInputError naming that field', () => {
    const bad = fc.constantFrom<unknown>(Number.NaN, Infinity, -Infinity, -1, 'two', {});
    const fields = fc.constantFrom('massKg', 'heightM', 'initialVelocityMps', 'dragAreaM2', 'airDensityKgM3', 'gravityMps2', 'windSpeedMps');
    fc.assert(
      fc.property(validDropInput, fields, bad, (input, field, value) => {
        if (field === 'initialVelocityMps' && value === -1) return; // any finite release speed is valid
        if ((field === 'dragAreaM2' || field === 'windSpeedMps') && value === -1) {
          expect(() => assessDrop({ ...input, [field]: value })).toThrow(expect.objectContaining({ name: 'DropInputError', field, code: 'negative' }));
          return;
        }
        expect(() => assessDrop({ ...input, [field]: value } as DropInput)).toThrow(expect.objectContaining({ name: 'DropInputError', field }));
      }),
      { numRuns: 300 },
    );
  });
});

/** Every number in an assessment, nested fields included, as [path, value]. */
function numericFields(value: unknown, path = ''): [string, number][] {
  if (typeof value === 'number') return [[path, value]];
  if (typeof value !== 'object' || value === null) return [];
  return Object.entries(value).flatMap(([key, inner]) => numericFields(inner, path ? `${path}.${key}` : key));
}

const logUniform = (min: number, max: number) => fc.double({ min: Math.log(min), max: Math.log(max), noNaN: true }).map(Math.exp);
const size = logUniform(0.005, 2);
const shape: fc.Arbitrary<ShapeSpec> = fc.oneof(
  fc.record({ kind: fc.constant('box' as const), lengthM: size, widthM: size, heightM: size, orientation: fc.constantFrom(...ORIENTATIONS) }),
  fc.record({ kind: fc.constant('plate' as const), lengthM: size, widthM: size, thicknessM: size }),
  fc.record({ kind: fc.constant('rod' as const), lengthM: size, diameterM: size, orientation: fc.constantFrom(...ORIENTATIONS) }),
  fc.record({ kind: fc.constant('sphere' as const), diameterM: size }),
);

/** Realistic and edge-of-range valid inputs: 1 g–1 t, 0.1 m–1 km, thrown either way, half of them in wind. */
const validDropInput: fc.Arbitrary<DropInput> = fc
  .record(
    {
      massKg: logUniform(0.001, 1000),
      heightM: logUniform(0.1, 1000),
      initialVelocityMps: fc.double({ min: -30, max: 30, noNaN: true }),
      drag: fc.oneof(
        { weight: 1, arbitrary: fc.constant({}) },
        { weight: 4, arbitrary: logUniform(1e-5, 1).map((dragAreaM2) => ({ dragAreaM2 })) },
        { weight: 4, arbitrary: shape.map((s) => ({ shape: s })) },
      ),
      windSpeedMps: fc.oneof(fc.constant(undefined), logUniform(0.5, 40)),
      airDensityKgM3: fc.double({ min: 0.5, max: 1.5, noNaN: true }),
      gravityMps2: fc.double({ min: 1.6, max: 25, noNaN: true }),
      exposure: fc.constantFrom('bare-head' as const, 'helmet' as const),
      contact: fc.oneof(
        fc.constant(undefined),
        fc.record({ item: fc.constantFrom('hard' as const, 'soft' as const) }),
        fc.record({ durationS: logUniform(1e-4, 0.05), pulse: fc.constantFrom(...PULSES) }),
        fc.record({ stoppingDistanceM: logUniform(1e-3, 0.2) }),
      ),
    },
    { requiredKeys: ['massKg', 'heightM', 'drag', 'windSpeedMps'] },
  )
  .map(({ drag, ...rest }) => ({ ...rest, ...drag }) as DropInput);
