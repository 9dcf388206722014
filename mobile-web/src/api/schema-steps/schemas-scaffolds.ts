/** A step of building-schemas.ts: scaffolds. */
export { ScaffoldSchema } from '@plummet/shared';
