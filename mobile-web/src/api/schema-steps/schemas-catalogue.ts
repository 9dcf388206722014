/** A step of building-schemas.ts: the item catalogue. */
export { CatalogueItemSchema } from '@plummet/shared';
