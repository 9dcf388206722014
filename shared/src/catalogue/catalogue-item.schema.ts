/** The item catalogue: built-in items (shared by everyone) and items an organisation adds. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, MassKgSchema, NameSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema, QueryBooleanSchema, queryList } from '../common/list.schema.js';
import { ShapeSpecSchema } from './shape-spec.schema.js';

export const CATALOGUE_CATEGORIES = ['hand-tool', 'fitting', 'board', 'tube', 'material', 'debris', 'other'] as const;
export const CatalogueCategorySchema = z.enum(CATALOGUE_CATEGORIES);
export type CatalogueCategory = z.infer<typeof CatalogueCategorySchema>;

export const CatalogueItemSchema = z.object({
  id: IdSchema,
  name: z.string(),
  category: CatalogueCategorySchema,
  massKg: z.number(),
  shape: ShapeSpecSchema,
  /** Where the mass and size come from (a standard, a maker's data sheet, a measurement, memory). */
  source: z.string(),
  /** Built-in items are the same for every organisation and cannot be changed. */
  builtIn: z.boolean(),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type CatalogueItem = z.infer<typeof CatalogueItemSchema>;

const itemFields = {
  name: NameSchema,
  category: CatalogueCategorySchema,
  massKg: MassKgSchema,
  shape: ShapeSpecSchema,
  source: z.string().trim().min(1).max(500),
};

export const CatalogueItemCreateSchema = z.object(itemFields);
export type CatalogueItemCreate = z.infer<typeof CatalogueItemCreateSchema>;

export const CatalogueItemUpdateSchema = z
  .object({ ...z.object(itemFields).partial().shape, version: VersionSchema.optional() })
  .refine((v) => Object.keys(v).some((k) => k !== 'version'), 'Nothing to change');
export type CatalogueItemUpdate = z.infer<typeof CatalogueItemUpdateSchema>;

export const CatalogueListQuerySchema = z.object({
  ...listQueryShape(['name', 'category', 'massKg'], 'name', 'asc'),
  category: queryList(CatalogueCategorySchema).optional(),
  builtIn: QueryBooleanSchema.optional(),
  /** Part of the name, any case. */
  q: z.string().trim().min(1).max(100).optional(),
});
export type CatalogueListQuery = z.infer<typeof CatalogueListQuerySchema>;

export const CatalogueListResponseSchema = listResponseSchema(CatalogueItemSchema);
