/** A step of building-schemas.ts: inspections and their control checks. */
export { InspectionDetailSchema } from '@plummet/shared';
