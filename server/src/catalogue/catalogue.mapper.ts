import type { CatalogueCategory, CatalogueItem, ShapeSpec } from '@plummet/shared';
import type { catalogueItems } from '../db/schema/index.js';

export type CatalogueItemRow = typeof catalogueItems.$inferSelect;

export function toCatalogueItem(row: CatalogueItemRow): CatalogueItem {
  return {
    id: row.id,
    name: row.name,
    category: row.category as CatalogueCategory,
    massKg: row.massKg,
    shape: row.shape as ShapeSpec,
    source: row.source,
    builtIn: row.organisationId === null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}
