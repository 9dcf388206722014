/**
 * An organisation's own catalogue item: typed in the user's units, checked by the shared schema and,
 * for the shape, by the physics' own shape rules (the same that guard every estimate).
 */
import {
  CatalogueItemCreateSchema,
  SHAPE_DIMENSIONS,
  shapeIssuesOf,
  type CatalogueCategory,
  type CatalogueItem,
  type CatalogueItemCreate,
  type ShapeKind,
} from '@plummet/shared';
import { formatForInput, parseQuantity, type Units } from '../../lib/units';
import { fieldErrorsOf, type FieldErrors } from './form-errors';

export interface CatalogueForm {
  name: string;
  category: CatalogueCategory;
  mass: string;
  kind: ShapeKind;
  /** Dimension field (lengthM, widthM…) → the size typed in the user's units. */
  sizes: Record<string, string>;
  source: string;
}

export const newCatalogueForm = (): CatalogueForm => ({ name: '', category: 'other', mass: '', kind: 'box', sizes: {}, source: '' });

/** An own item back in the form, to change it. */
export function catalogueFormOf(item: CatalogueItem, units: Units): CatalogueForm {
  const sizes: Record<string, string> = {};
  for (const field of SHAPE_DIMENSIONS[item.shape.kind]) sizes[field] = formatForInput('size', (item.shape as unknown as Record<string, number>)[field], units);
  return { name: item.name, category: item.category, mass: formatForInput('mass', item.massKg, units), kind: item.shape.kind, sizes, source: item.source };
}

const DIMENSION_WORDS: Record<string, string> = { lengthM: 'Length', widthM: 'Width', heightM: 'Height', thicknessM: 'Thickness', diameterM: 'Diameter' };

export function readCatalogueForm(form: CatalogueForm, units: Units): { ok: true; body: CatalogueItemCreate } | { ok: false; errors: FieldErrors } {
  const shape: Record<string, unknown> = { kind: form.kind };
  for (const field of SHAPE_DIMENSIONS[form.kind]) shape[field] = parseQuantity('size', form.sizes[field] ?? '', units) ?? Number.NaN;
  const body = { name: form.name, category: form.category, massKg: parseQuantity('mass', form.mass, units) ?? Number.NaN, shape, source: form.source };
  const parsed = CatalogueItemCreateSchema.safeParse(body);
  const errors = parsed.success ? {} : fieldErrorsOf(parsed.error.issues);
  // The physics' words for a shape it cannot compute with, in place of the schema's.
  for (const issue of shapeIssuesOf(shape) ?? []) {
    const dimension = issue.field.split('.')[1] ?? '';
    errors[issue.field] = `${DIMENSION_WORDS[dimension] ?? 'This size'}: ${issue.code === 'required' || issue.code === 'not-a-number' ? 'a size is needed' : 'more than 0'}`;
  }
  if (errors.massKg && !Number.isFinite(body.massKg)) errors.massKg = 'A mass is needed';
  if (errors.source) errors.source = 'Say where the mass and size come from (a data sheet, a measurement…)';
  if (errors.name) errors.name = 'Give the item a name';
  return parsed.success && Object.keys(errors).length === 0 ? { ok: true, body: parsed.data } : { ok: false, errors };
}
