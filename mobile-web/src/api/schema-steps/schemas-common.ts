/** A step of building-schemas.ts: zod itself and the fields every schema is made of. */
export { DateTimeSchema } from '@plummet/shared';
