/** A step of building-schemas.ts: sites, and the answer around every list. */
export { SiteListResponseSchema } from '@plummet/shared';
