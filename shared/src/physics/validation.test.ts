import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessDrop } from './assess.js';
import type { DropInput } from './drop.types.js';
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

  it('never returns NaN: any input either throws DropInputError or gives finite numbers', () => {
    const anyNumber = fc.oneof(fc.double(), fc.constant(undefined), fc.constant(0), fc.integer({ min: -5, max: 5 }));
    fc.assert(
      fc.property(
        fc.record({ massKg: anyNumber, heightM: anyNumber, initialVelocityMps: anyNumber, dragAreaM2: anyNumber, windSpeedMps: anyNumber, airDensityKgM3: anyNumber }),
        (input) => {
          try {
            const d = assessDrop(input as DropInput);
            const numbers = [d.impactVelocityMps, d.vacuumImpactVelocityMps, d.fallTimeS, d.impactEnergyJ, d.meanForceN, d.peakForceN, d.driftM];
            return numbers.every(Number.isFinite) && !Number.isNaN(d.terminalVelocityMps);
          } catch (error) {
            return error instanceof DropInputError;
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
