import { BUILTIN_ITEMS } from '@plummet/shared';
import type { CatalogueItemRecord } from '../../local-db/records';
import { catalogueRecordOf } from '../catalogue/catalogue-search';
import { DEFAULT_ANSWERS, newFindingForm, type FindingForm } from '../findings/finding-form';

/** The calculator's starting point: a described item at a measured height, loose at the edge. */
export function newCalculatorForm(): FindingForm {
  return {
    ...newFindingForm({ elevation: '', lift: 1, bay: 1 }, null),
    heightMode: 'measured',
    heightText: '',
    exposure: 'public',
    answers: { ...DEFAULT_ANSWERS, edgeDistance: 'at-edge', footTraffic: 'frequent' },
  };
}

/** The built-in catalogue, for a phone that has not downloaded a site (or nobody signed in). */
export function builtinCatalogue(): CatalogueItemRecord[] {
  return BUILTIN_ITEMS.map((item) =>
    catalogueRecordOf({ ...item, builtIn: true, createdAt: '2026-01-01T00:00:00.000Z', updatedAt: '2026-01-01T00:00:00.000Z', version: 1 }),
  );
}
