/**
 * Validation of a drop input without zod, so the phone and the server can show field errors and the
 * physics never returns NaN. assessDrop throws a DropInputError naming the first bad field;
 * validateDropInput lists every issue.
 */
import { ITEM_HARDNESSES, PULSES } from './contact.js';
import { EXPOSURES } from './exposure.js';
import { ORIENTATIONS, SHAPE_DIMENSIONS, SHAPE_KINDS } from './shape.js';

export type DropInputErrorCode =
  | 'required'
  | 'not-an-object'
  | 'not-a-number'
  | 'not-finite'
  | 'not-positive'
  | 'negative'
  | 'not-an-option'
  | 'out-of-range';

/** One problem with one field; `field` is a path such as "shape.widthM". */
export interface DropFieldIssue {
  readonly field: string;
  readonly code: DropInputErrorCode;
  readonly message: string;
}

/** Thrown for invalid input; names the (first) field at fault and carries every issue found. */
export class DropInputError extends Error {
  readonly field: string;
  readonly code: DropInputErrorCode;
  readonly issues: readonly DropFieldIssue[];

  constructor(issues: readonly DropFieldIssue[]) {
    const first = issues[0] ?? { field: 'input', code: 'required' as const, message: 'The input is missing.' };
    super(first.message);
    this.name = 'DropInputError';
    this.field = first.field;
    this.code = first.code;
    this.issues = issues;
  }
}

const MESSAGES: Record<DropInputErrorCode, string> = {
  required: 'is required',
  'not-an-object': 'must be an object',
  'not-a-number': 'must be a number',
  'not-finite': 'must be a finite number',
  'not-positive': 'must be greater than zero',
  negative: 'must not be negative',
  'not-an-option': 'is not one of the allowed values',
  'out-of-range': 'gives a result outside the range this estimate can represent',
};

/** Builds an issue with a plain-English message. */
export function dropIssue(field: string, code: DropInputErrorCode, detail?: string): DropFieldIssue {
  return { field, code, message: `${field} ${MESSAGES[code]}${detail ? ` (${detail})` : ''}.` };
}

type Rule = 'positive' | 'non-negative' | 'finite';

function numberCode(value: unknown, rule: Rule): DropInputErrorCode | undefined {
  if (typeof value !== 'number' || value !== value) return 'not-a-number';
  if (value === Infinity || value === -Infinity) return 'not-finite';
  if (rule === 'positive') return value > 0 ? undefined : 'not-positive';
  if (rule === 'non-negative') return value >= 0 ? undefined : 'negative';
  return undefined;
}

const absent = (value: unknown): boolean => value === undefined || value === null;

/**
 * Scans the input; returns undefined when valid (no allocation), otherwise the issues (only the
 * first when `all` is false).
 */
function scan(input: unknown, all: boolean): DropFieldIssue[] | undefined {
  if (typeof input !== 'object' || input === null) return [dropIssue('input', 'not-an-object')];
  const o = input as Record<string, unknown>;
  let issues: DropFieldIssue[] | undefined;
  const report = (field: string, code: DropInputErrorCode, detail?: string): boolean => {
    (issues ??= []).push(dropIssue(field, code, detail));
    return !all;
  };
  const num = (value: unknown, field: string, rule: Rule, required: boolean): boolean => {
    if (absent(value)) return required ? report(field, 'required') : false;
    const code = numberCode(value, rule);
    return code !== undefined ? report(field, code) : false;
  };
  const option = (value: unknown, field: string, allowed: readonly string[]): boolean =>
    !absent(value) && !allowed.includes(value as string) ? report(field, 'not-an-option', allowed.join(', ')) : false;

  if (num(o.massKg, 'massKg', 'positive', true)) return issues;
  if (num(o.heightM, 'heightM', 'positive', true)) return issues;
  if (num(o.initialVelocityMps, 'initialVelocityMps', 'finite', false)) return issues;
  if (num(o.dragAreaM2, 'dragAreaM2', 'non-negative', false)) return issues;
  if (num(o.airDensityKgM3, 'airDensityKgM3', 'positive', false)) return issues;
  if (num(o.gravityMps2, 'gravityMps2', 'positive', false)) return issues;
  if (num(o.windSpeedMps, 'windSpeedMps', 'non-negative', false)) return issues;
  if (option(o.exposure, 'exposure', EXPOSURES)) return issues;
  if (!absent(o.shape)) {
    const shapeIssues = shapeIssuesOf(o.shape, 'shape', all);
    if (shapeIssues) {
      (issues ??= []).push(...shapeIssues);
      if (!all) return issues;
    }
  }
  if (!absent(o.contact)) {
    const c = o.contact as Record<string, unknown>;
    if (typeof c !== 'object') {
      if (report('contact', 'not-an-object')) return issues;
    } else {
      if (num(c.durationS, 'contact.durationS', 'positive', false)) return issues;
      if (num(c.stoppingDistanceM, 'contact.stoppingDistanceM', 'positive', false)) return issues;
      if (option(c.pulse, 'contact.pulse', PULSES)) return issues;
      if (option(c.item, 'contact.item', ITEM_HARDNESSES)) return issues;
    }
  }
  return issues;
}

/** Issues of a shape (undefined when valid); `prefix` is the field path of the shape. */
export function shapeIssuesOf(shape: unknown, prefix = 'shape', all = true): DropFieldIssue[] | undefined {
  if (typeof shape !== 'object' || shape === null) return [dropIssue(prefix, 'not-an-object')];
  const s = shape as Record<string, unknown>;
  if (!SHAPE_KINDS.includes(s.kind as never)) return [dropIssue(`${prefix}.kind`, 'not-an-option', SHAPE_KINDS.join(', '))];
  let issues: DropFieldIssue[] | undefined;
  for (const dimension of SHAPE_DIMENSIONS[s.kind as keyof typeof SHAPE_DIMENSIONS]) {
    const value = s[dimension];
    const code = absent(value) ? 'required' : numberCode(value, 'positive');
    if (code !== undefined) {
      (issues ??= []).push(dropIssue(`${prefix}.${dimension}`, code));
      if (!all) return issues;
    }
  }
  if (!absent(s.orientation) && !ORIENTATIONS.includes(s.orientation as never)) {
    (issues ??= []).push(dropIssue(`${prefix}.orientation`, 'not-an-option', ORIENTATIONS.join(', ')));
  }
  return issues;
}

/** Every issue with a drop input; an empty list when it is valid. */
export function validateDropInput(input: unknown): DropFieldIssue[] {
  return scan(input, true) ?? [];
}

const positive = (v: unknown): boolean => typeof v === 'number' && v > 0 && v < Infinity;
const optionalPositive = (v: unknown): boolean => v === undefined || positive(v);
const optionalNonNegative = (v: unknown): boolean => v === undefined || (typeof v === 'number' && v >= 0 && v < Infinity);

function plainlyValidShape(shape: unknown): boolean {
  if (typeof shape !== 'object' || shape === null) return false;
  const s = shape as Record<string, unknown>;
  const o = s.orientation;
  if (!(o === undefined || o === 'tumbling' || o === 'flat' || o === 'edge' || o === 'worst')) return false;
  switch (s.kind) {
    case 'box':
      return positive(s.lengthM) && positive(s.widthM) && positive(s.heightM);
    case 'plate':
      return positive(s.lengthM) && positive(s.widthM) && positive(s.thicknessM);
    case 'cylinder':
    case 'rod':
      return positive(s.lengthM) && positive(s.diameterM);
    case 'sphere':
      return positive(s.diameterM);
    default:
      return false;
  }
}

/**
 * A quick check with no allocation that accepts only plainly valid inputs (no nulls, no unknown values).
 * Anything else goes through the full scan, which alone decides.
 */
function plainlyValid(o: Record<string, unknown>): boolean {
  const v0 = o.initialVelocityMps;
  const contact = o.contact as Record<string, unknown> | undefined;
  const exposure = o.exposure;
  return (
    positive(o.massKg) &&
    positive(o.heightM) &&
    (v0 === undefined || (typeof v0 === 'number' && v0 > -Infinity && v0 < Infinity)) &&
    optionalNonNegative(o.dragAreaM2) &&
    optionalPositive(o.airDensityKgM3) &&
    optionalPositive(o.gravityMps2) &&
    optionalNonNegative(o.windSpeedMps) &&
    (exposure === undefined || exposure === 'bare-head' || exposure === 'helmet') &&
    (o.shape === undefined || plainlyValidShape(o.shape)) &&
    (contact === undefined ||
      (typeof contact === 'object' &&
        contact !== null &&
        optionalPositive(contact.durationS) &&
        optionalPositive(contact.stoppingDistanceM) &&
        (contact.pulse === undefined || contact.pulse === 'half-sine' || contact.pulse === 'rectangular' || contact.pulse === 'triangular') &&
        (contact.item === undefined || contact.item === 'hard' || contact.item === 'soft')))
  );
}

/** The first issue with a drop input, or undefined when it is valid (no allocation for plain valid input). */
export function firstDropInputIssue(input: unknown): DropFieldIssue | undefined {
  if (typeof input === 'object' && input !== null && plainlyValid(input as Record<string, unknown>)) return undefined;
  return scan(input, false)?.[0];
}

/** Throws a DropInputError when `value` is not a finite number (guards results against NaN). */
export function assertFiniteResult(value: number, field: string): void {
  if (!Number.isFinite(value)) throw new DropInputError([dropIssue(field, 'out-of-range')]);
}
