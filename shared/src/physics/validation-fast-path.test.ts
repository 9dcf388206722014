/**
 * The quick acceptance check inside firstDropInputIssue (no allocation, used by every estimate) must
 * accept exactly what the full scan accepts: it may hand a valid input to the scan, but it must never
 * pass an input the scan rejects. Generated inputs mix valid values with the edge of every range
 * (0, −0, the smallest and largest doubles), NaN, infinities, strings, null, wrong types, missing
 * fields, unknown shape kinds and options, extra fields and objects without a prototype.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assessDrop } from './assess.js';
import { ITEM_HARDNESSES, PULSES } from './contact.js';
import type { DropInput } from './drop.types.js';
import { EXPOSURES } from './exposure.js';
import { ORIENTATIONS, SHAPE_KINDS } from './shape.js';
import { DropInputError, firstDropInputIssue, validateDropInput } from './validation.js';

const EDGE_NUMBERS = [0, -0, Number.MIN_VALUE, -Number.MIN_VALUE, Number.MAX_VALUE, -Number.MAX_VALUE, 1e-300, -1, 1, Number.NaN, Infinity, -Infinity];
const NOT_NUMBERS = ['', '1', 'abc', null, true, false, {}, [], [1], 1n, () => 1];

/** Valid positive numbers, the smallest and largest doubles among them. */
const positive: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 6, arbitrary: fc.double({ min: 1e-6, max: 1e6, noNaN: true }) },
  { weight: 1, arbitrary: fc.constantFrom<unknown>(Number.MIN_VALUE, 1e-300, Number.MAX_VALUE) },
);

/** Any value: valid numbers, edge values and values of the wrong type. */
const anything: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: positive },
  { weight: 2, arbitrary: fc.constantFrom<unknown>(...EDGE_NUMBERS) },
  { weight: 1, arbitrary: fc.double() }, // any double, NaN and infinities included
  { weight: 1, arbitrary: fc.constantFrom<unknown>(...NOT_NUMBERS) },
);

const anyOption = (allowed: readonly string[]): fc.Arbitrary<unknown> =>
  fc.oneof(
    { weight: 4, arbitrary: fc.constantFrom<unknown>(...allowed) },
    { weight: 1, arbitrary: fc.constantFrom<unknown>(null, '', 'HELMET', allowed[0]!.toUpperCase(), ` ${allowed[0]}`, 1, {}) },
  );
const validOption = (allowed: readonly string[]): fc.Arbitrary<unknown> => fc.constantFrom<unknown>(...allowed);

/**
 * Input objects whose numbers come from `value` and options from `option` (valid ones, or anything):
 * every field optional, massKg and heightM usually there, extra fields at times.
 */
function inputObject(value: fc.Arbitrary<unknown>, option: (allowed: readonly string[]) => fc.Arbitrary<unknown>, valid: boolean) {
  const nonNegative = valid ? fc.oneof(value, fc.constantFrom<unknown>(0, -0)) : value;
  const contact = fc.oneof(
    { weight: 4, arbitrary: fc.record({ durationS: value, stoppingDistanceM: value, pulse: option(PULSES), item: option(ITEM_HARDNESSES) }, { requiredKeys: [] }) },
    { weight: valid ? 0 : 1, arbitrary: fc.constantFrom<unknown>(null, 'hard', 1, [], () => ({})) },
  );
  const shape = fc.oneof(
    {
      weight: 4,
      arbitrary: fc.record(
        {
          kind: valid ? option(SHAPE_KINDS) : option([...SHAPE_KINDS, 'cone']),
          lengthM: value,
          widthM: value,
          heightM: value,
          thicknessM: value,
          diameterM: value,
          orientation: option(ORIENTATIONS),
        },
        { requiredKeys: valid ? ['kind', 'lengthM', 'widthM', 'heightM', 'thicknessM', 'diameterM'] : ['kind'] },
      ),
    },
    { weight: valid ? 0 : 1, arbitrary: fc.constantFrom<unknown>(null, 'box', 1, []) },
  );
  return fc
    .record(
      {
        massKg: value,
        heightM: value,
        initialVelocityMps: valid ? fc.double({ min: -Number.MAX_VALUE, max: Number.MAX_VALUE, noNaN: true }) : anything,
        dragAreaM2: nonNegative,
        airDensityKgM3: value,
        gravityMps2: value,
        windSpeedMps: nonNegative,
        exposure: option(EXPOSURES),
        contact,
        shape,
        note: fc.constantFrom<unknown>('an extra field', -1, Number.NaN, null),
        massKG: anything,
      },
      { requiredKeys: valid ? ['massKg', 'heightM'] : [] },
    )
    .chain((fields) =>
      fc.constantFrom(
        fields,
        { ...fields, massKg: 1, heightM: 5 }, // required fields valid, so that the optional ones decide
        Object.assign(Object.create(null) as object, fields),
      ),
    );
}

const input: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 10, arbitrary: inputObject(positive, validOption, true) },
  { weight: 10, arbitrary: inputObject(anything, anyOption, false) },
  { weight: 1, arbitrary: fc.constantFrom<unknown>(undefined, null, 0, 'massKg', [], () => ({ massKg: 1, heightM: 1 })) },
);

describe('quick acceptance of drop inputs', () => {
  it('accepts exactly what the full scan accepts, and reports the same first issue', () => {
    let accepted = 0;
    let rejected = 0;
    fc.assert(
      fc.property(input, (x) => {
        const issues = validateDropInput(x);
        const first = firstDropInputIssue(x);
        expect(first).toEqual(issues[0]);
        if (issues.length === 0) accepted++;
        else rejected++;
      }),
      { numRuns: 20_000 },
    );
    // Both sides must be well covered for the comparison to mean anything.
    expect(accepted).toBeGreaterThan(1000);
    expect(rejected).toBeGreaterThan(1000);
  }, 30_000);

  it('accepts the plainly valid inputs of the estimate, each field at its bounds', () => {
    const plain: DropInput[] = [
      { massKg: Number.MIN_VALUE, heightM: Number.MIN_VALUE },
      { massKg: 1, heightM: 5, initialVelocityMps: -Number.MAX_VALUE, dragAreaM2: 0, windSpeedMps: 0 },
      { massKg: 1, heightM: 5, initialVelocityMps: 0, dragAreaM2: -0, windSpeedMps: -0, airDensityKgM3: Number.MIN_VALUE, gravityMps2: Number.MAX_VALUE },
      { massKg: 1, heightM: 5, exposure: 'helmet', contact: { durationS: Number.MIN_VALUE, stoppingDistanceM: 1, pulse: 'triangular', item: 'soft' } },
      { massKg: 1, heightM: 5, shape: { kind: 'cylinder', lengthM: 1, diameterM: 1, orientation: 'worst' } },
      { massKg: 1, heightM: 5, shape: { kind: 'plate', lengthM: 1, widthM: 1, thicknessM: 1, orientation: 'edge' } },
    ];
    for (const x of plain) {
      expect(validateDropInput(x)).toEqual([]);
      expect(firstDropInputIssue(x)).toBeUndefined();
    }
  });

  it('throws from the estimate the error the full scan describes, every issue included', () => {
    fc.assert(
      fc.property(input, (x) => {
        const issues = validateDropInput(x);
        fc.pre(issues.length > 0);
        let thrown: unknown;
        try {
          assessDrop(x as DropInput);
        } catch (error) {
          thrown = error;
        }
        expect(thrown).toBeInstanceOf(DropInputError);
        const error = thrown as DropInputError;
        expect({ field: error.field, code: error.code, message: error.message, issues: error.issues }).toEqual({
          field: issues[0]!.field,
          code: issues[0]!.code,
          message: issues[0]!.message,
          issues,
        });
      }),
      { numRuns: 3_000 },
    );
  }, 30_000);
});
