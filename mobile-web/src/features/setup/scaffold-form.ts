/**
 * The scaffold form's state, the drawing it previews while typing, and the request body it makes,
 * checked with the shared schema. Heights are typed in the user's units and sent in metres.
 */
import {
  LIFTS_MAX,
  ScaffoldCreateSchema,
  ScaffoldUpdateSchema,
  type InspectionRegime,
  type LoadClass,
  type Scaffold,
  type ScaffoldCreate,
} from '@plummet/shared';
import { formatForInput, parseDecimal, parseQuantity, type Units } from '../../lib/units';
import { fieldErrorsOf, type FieldErrors } from './form-errors';

export interface ScaffoldForm {
  reference: string;
  description: string;
  /** Elevation names, one per line or separated by commas. */
  elevations: string;
  lifts: string;
  baysPerElevation: string;
  /** The usual height of a lift, in the user's units. */
  liftHeight: string;
  /** Lifts differ: one height per lift from the bottom, in the user's units. */
  liftsDiffer: boolean;
  liftHeights: string[];
  foremanId: string;
  /** '' follows the site's regime. */
  regime: '' | InspectionRegime;
  loadClass: '' | LoadClass;
  designReference: string;
  erectingContractor: string;
  handedOverOn: string;
}

export function newScaffoldForm(units: Units): ScaffoldForm {
  return {
    reference: '',
    description: '',
    elevations: 'North',
    lifts: '4',
    baysPerElevation: '8',
    liftHeight: formatForInput('height', 2, units),
    liftsDiffer: false,
    liftHeights: [],
    foremanId: '',
    regime: '',
    loadClass: '',
    designReference: '',
    erectingContractor: '',
    handedOverOn: '',
  };
}

export function scaffoldFormOf(scaffold: Scaffold, units: Units): ScaffoldForm {
  return {
    reference: scaffold.reference,
    description: scaffold.description,
    elevations: scaffold.elevations.join(', '),
    lifts: String(scaffold.lifts),
    baysPerElevation: String(scaffold.baysPerElevation),
    liftHeight: formatForInput('height', scaffold.liftHeightM, units),
    liftsDiffer: scaffold.liftHeightsM.length > 0,
    liftHeights: scaffold.liftHeightsM.map((h) => formatForInput('height', h, units)),
    foremanId: scaffold.foremanId ?? '',
    regime: scaffold.regime ?? '',
    loadClass: scaffold.loadClass ?? '',
    designReference: scaffold.designReference,
    erectingContractor: scaffold.erectingContractor,
    handedOverOn: scaffold.handedOverOn ?? '',
  };
}

export const splitElevations = (text: string): string[] =>
  text
    .split(/[\n,]/)
    .map((name) => name.trim())
    .filter((name) => name !== '');

const wholeNumber = (text: string): number => (/^\s*\d+\s*$/.test(text) ? Number(text) : Number.NaN);

/** The per-lift heights resized to `lifts`, new lifts taking the usual height. */
export function resizeLiftHeights(form: ScaffoldForm): string[] {
  const lifts = wholeNumber(form.lifts);
  if (!Number.isFinite(lifts) || lifts < 1 || lifts > LIFTS_MAX) return form.liftHeights;
  return Array.from({ length: lifts }, (_, i) => form.liftHeights[i] ?? form.liftHeight);
}

/** Everything but siteId, as the schema wants it (unparseable numbers stay NaN for the schema to name). */
function fieldsOf(form: ScaffoldForm, units: Units) {
  const height = (text: string) => parseQuantity('height', text, units) ?? Number.NaN;
  return {
    reference: form.reference,
    description: form.description,
    elevations: splitElevations(form.elevations),
    lifts: wholeNumber(form.lifts),
    baysPerElevation: wholeNumber(form.baysPerElevation),
    liftHeightM: height(form.liftHeight),
    liftHeightsM: form.liftsDiffer ? resizeLiftHeights(form).map(height) : [],
    foremanId: form.foremanId === '' ? null : form.foremanId,
    regime: form.regime === '' ? null : form.regime,
    loadClass: form.loadClass === '' ? null : form.loadClass,
    designReference: form.designReference,
    erectingContractor: form.erectingContractor,
    handedOverOn: form.handedOverOn === '' ? null : form.handedOverOn,
  };
}

export type ScaffoldFormResult<T> = { ok: true; body: T } | { ok: false; errors: FieldErrors };

export function readScaffoldForm(form: ScaffoldForm, siteId: string, units: Units): ScaffoldFormResult<ScaffoldCreate> {
  const parsed = ScaffoldCreateSchema.safeParse({ siteId, ...fieldsOf(form, units) });
  return parsed.success ? { ok: true, body: parsed.data } : { ok: false, errors: fieldErrorsOf(parsed.error.issues) };
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** The change to an existing scaffold: the fields that differ, checked as a whole first. */
export function readScaffoldChange(form: ScaffoldForm, scaffold: Scaffold, units: Units): ScaffoldFormResult<Record<string, unknown>> {
  const whole = readScaffoldForm(form, scaffold.siteId, units);
  if (!whole.ok) return whole;
  const before: Record<string, unknown> = { ...scaffold };
  const changes: Record<string, unknown> = { version: scaffold.version };
  for (const [key, value] of Object.entries(fieldsOf(form, units))) {
    const typed = (whole.body as Record<string, unknown>)[key] ?? value;
    // Heights typed in feet come back with rounding: an unchanged text is no change.
    if (key === 'liftHeightM' && form.liftHeight === formatForInput('height', scaffold.liftHeightM, units)) continue;
    if (!same(typed, before[key])) changes[key] = typed;
  }
  const parsed = ScaffoldUpdateSchema.safeParse(changes);
  return parsed.success ? { ok: true, body: parsed.data } : { ok: false, errors: { '': 'Nothing has changed' } };
}

/** What the drawing shows while the form is typed: the last sensible reading of each number. */
export interface ScaffoldPreview {
  elevations: string[];
  lifts: number;
  bays: number;
  liftHeightM: number;
  liftHeightsM: number[];
}

export function previewOf(form: ScaffoldForm, units: Units): ScaffoldPreview {
  const clamp = (value: number, max: number, fallback: number) => (Number.isFinite(value) && value >= 1 ? Math.min(Math.floor(value), max) : fallback);
  const positive = (text: string, fallback: number) => {
    const shown = parseDecimal(text);
    const si = shown === undefined ? undefined : parseQuantity('height', text, units);
    return si !== undefined && si > 0 ? si : fallback;
  };
  const lifts = clamp(wholeNumber(form.lifts), LIFTS_MAX, 1);
  const liftHeightM = positive(form.liftHeight, 2);
  const elevations = splitElevations(form.elevations);
  return {
    elevations: elevations.length > 0 ? elevations : ['Elevation'],
    lifts,
    bays: clamp(wholeNumber(form.baysPerElevation), 200, 1),
    liftHeightM,
    liftHeightsM: form.liftsDiffer ? resizeLiftHeights({ ...form, lifts: String(lifts) }).map((text) => positive(text, liftHeightM)) : [],
  };
}
