/**
 * The finding editor's form: what the inspector typed (text, in their units) and how it becomes
 * the SI input of the estimate. Pure, so the estimate can be computed in render on every keystroke.
 */
import {
  LIMITS,
  liftPlatformHeightM,
  SHAPE_DIMENSIONS,
  type CatalogueItem,
  type FindingEstimateInput,
  type FindingExposure,
  type LikelihoodAnswers,
  type Orientation,
  type ShapeKind,
  type ShapeSpec,
} from '@plummet/shared';
import { parseQuantity, formatForInput, type Units } from '../../lib/units';

export type HeightMode = 'lift' | 'measured';
export type ItemMode = 'catalogue' | 'custom';
/** 'unknown': no shape given, so the estimate has no air drag (the worst case). */
export type ShapeChoice = ShapeKind | 'unknown';

export interface FindingForm {
  elevation: string;
  lift: number;
  bay: number;
  heightMode: HeightMode;
  /** Measured height, display units. */
  heightText: string;
  itemMode: ItemMode;
  catalogueItemId?: string;
  customName: string;
  /** Custom mass, display units. */
  massText: string;
  shape: ShapeChoice;
  /** Custom dimensions by field name (lengthM, widthM…), display units (cm or in). */
  dimensionTexts: Record<string, string>;
  orientation: Orientation;
  exposure: FindingExposure;
  answers: LikelihoodAnswers;
  notes: string;
  madeSafe: boolean;
  madeSafeNote: string;
}

/** Answers a new finding starts with: the common case of a loose item near the edge. */
export const DEFAULT_ANSWERS: LikelihoodAnswers = {
  securing: 'loose',
  edgeDistance: 'near-edge',
  activity: 'light',
  wind: 'calm',
  footTraffic: 'occasional',
};

/** The likelihood's wind answer for a measured wind (Beaufort 4 from 5.5 m/s, 6 from 10.8 m/s). */
export function windAnswerFor(windSpeedMps: number | null | undefined): LikelihoodAnswers['wind'] {
  if (windSpeedMps == null || windSpeedMps < 5.5) return 'calm';
  return windSpeedMps < 10.8 ? 'breezy' : 'strong';
}

/** Height of lift `lift`'s platform, m: the sum of the lifts below it (each its own height when listed). */
export function heightOfLift(lift: number, liftHeightM: number, liftHeightsM?: readonly number[] | null): number {
  return liftPlatformHeightM({ lifts: lift, liftHeightM, liftHeightsM }, lift);
}

export interface FormContext {
  units: Units;
  liftHeightM: number;
  /** One height per lift when they differ (empty or absent: all are liftHeightM). */
  liftHeightsM?: readonly number[] | null;
  windSpeedMps: number | null;
  catalogueItem?: Pick<CatalogueItem, 'id' | 'name' | 'massKg' | 'shape'>;
}

/** The item as the estimate and the record need it. */
export interface ResolvedItem {
  catalogueItemId: string | null;
  name: string;
  massKg: number;
  shape: ShapeSpec | null;
}

export interface FormReading {
  /** Set when everything the estimate needs is there and valid. */
  input?: FindingEstimateInput;
  item?: ResolvedItem;
  heightM?: number;
  /** Field → sentence, for the fields that stop the estimate or the save. */
  problems: Partial<Record<'height' | 'item' | 'name' | 'mass' | 'dimensions' | 'madeSafeNote', string>>;
}

function readShape(form: FindingForm, units: Units): { shape: ShapeSpec | null; problem?: string } {
  if (form.shape === 'unknown') return { shape: null };
  const fields = SHAPE_DIMENSIONS[form.shape];
  const values: Record<string, number> = {};
  for (const field of fields) {
    const value = parseQuantity('size', form.dimensionTexts[field] ?? '', units);
    if (value === undefined || value <= 0) return { shape: null, problem: 'Enter every dimension of the shape (more than zero).' };
    if (value > LIMITS.dimensionMaxM) return { shape: null, problem: `A dimension cannot exceed ${LIMITS.dimensionMaxM} m.` };
    values[field] = value;
  }
  return { shape: { kind: form.shape, ...values, orientation: form.orientation } as ShapeSpec };
}

function readItem(form: FindingForm, context: FormContext): { item?: ResolvedItem; problems: FormReading['problems'] } {
  if (form.itemMode === 'catalogue') {
    const chosen = context.catalogueItem;
    if (!chosen || chosen.id !== form.catalogueItemId) return { problems: { item: 'Choose an item from the catalogue, or describe your own.' } };
    return { item: { catalogueItemId: chosen.id, name: chosen.name, massKg: chosen.massKg, shape: chosen.shape }, problems: {} };
  }
  const problems: FormReading['problems'] = {};
  const name = form.customName.trim();
  if (!name) problems.name = 'Name the item.';
  const massKg = parseQuantity('mass', form.massText, context.units);
  if (massKg === undefined || massKg <= 0) problems.mass = 'Enter the mass (more than zero).';
  else if (massKg > LIMITS.massMaxKg) problems.mass = `The mass cannot exceed ${LIMITS.massMaxKg} kg.`;
  const { shape, problem } = readShape(form, context.units);
  if (problem) problems.dimensions = problem;
  if (problems.mass || problems.dimensions) return { problems };
  return { item: { catalogueItemId: null, name: name || 'Unnamed item', massKg: massKg!, shape }, problems };
}

export function readHeight(form: FindingForm, context: FormContext): { heightM?: number; problem?: string } {
  if (form.heightMode === 'lift') return { heightM: heightOfLift(form.lift, context.liftHeightM, context.liftHeightsM) };
  const heightM = parseQuantity('height', form.heightText, context.units);
  if (heightM === undefined || heightM <= 0) return { problem: 'Enter the measured height (more than zero).' };
  if (heightM > LIMITS.heightMaxM) return { problem: `The height cannot exceed ${LIMITS.heightMaxM} m.` };
  return { heightM };
}

/** Reads the form into the estimate's SI input, or says what is missing. */
export function readFindingForm(form: FindingForm, context: FormContext): FormReading {
  const { item, problems } = readItem(form, context);
  const height = readHeight(form, context);
  if (height.problem) problems.height = height.problem;
  if (form.madeSafe && !form.madeSafeNote.trim()) problems.madeSafeNote = 'Say how it was made safe.';
  if (!item || height.heightM === undefined) return { item, heightM: height.heightM, problems };
  return {
    item,
    heightM: height.heightM,
    problems,
    input: {
      massKg: item.massKg,
      heightM: height.heightM,
      shape: item.shape,
      exposure: form.exposure,
      likelihoodAnswers: form.answers,
      windSpeedMps: context.windSpeedMps,
    },
  };
}

/** A blank form for a new finding at a spot of the grid. */
export function newFindingForm(spot: { elevation: string; lift: number; bay: number }, windSpeedMps: number | null): FindingForm {
  return {
    ...spot,
    heightMode: 'lift',
    heightText: '',
    itemMode: 'catalogue',
    customName: '',
    massText: '',
    shape: 'box',
    dimensionTexts: {},
    orientation: 'tumbling',
    exposure: 'hard-hats',
    answers: { ...DEFAULT_ANSWERS, wind: windAnswerFor(windSpeedMps) },
    notes: '',
    madeSafe: false,
    madeSafeNote: '',
  };
}

/** The form of a saved finding, in the user's units. */
export function formOfFinding(
  finding: {
    elevation: string;
    lift: number;
    bay: number;
    heightM: number;
    item: ResolvedItem;
    exposure: FindingExposure;
    likelihoodAnswers: LikelihoodAnswers;
    notes: string;
    state: string;
    madeSafeNote: string | null;
  },
  context: { units: Units; liftHeightM: number; liftHeightsM?: readonly number[] | null },
): FindingForm {
  const fromLift = Math.abs(finding.heightM - heightOfLift(finding.lift, context.liftHeightM, context.liftHeightsM)) < 1e-9;
  const shape = finding.item.shape;
  const dimensionTexts: Record<string, string> = {};
  if (shape) {
    for (const field of SHAPE_DIMENSIONS[shape.kind]) {
      dimensionTexts[field] = formatForInput('size', (shape as unknown as Record<string, number>)[field], context.units);
    }
  }
  return {
    elevation: finding.elevation,
    lift: finding.lift,
    bay: finding.bay,
    heightMode: fromLift ? 'lift' : 'measured',
    heightText: fromLift ? '' : formatForInput('height', finding.heightM, context.units),
    itemMode: finding.item.catalogueItemId ? 'catalogue' : 'custom',
    catalogueItemId: finding.item.catalogueItemId ?? undefined,
    customName: finding.item.catalogueItemId ? '' : finding.item.name,
    massText: finding.item.catalogueItemId ? '' : formatForInput('mass', finding.item.massKg, context.units),
    shape: shape ? shape.kind : 'unknown',
    dimensionTexts,
    orientation: shape?.orientation ?? 'tumbling',
    exposure: finding.exposure,
    answers: finding.likelihoodAnswers,
    notes: finding.notes,
    madeSafe: finding.state === 'made-safe',
    madeSafeNote: finding.madeSafeNote ?? '',
  };
}
