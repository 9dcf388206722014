/** A step of building-schemas.ts: the due list and the triggers. */
export { RegisterDueListSchema, ScaffoldTriggerResultSchema } from '@plummet/shared';
