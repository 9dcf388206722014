/** A step of building-schemas.ts: findings, with their items' shapes. */
export { FindingSchema } from '@plummet/shared';
