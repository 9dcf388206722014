/** Reports per scaffold: its inspections with what each recorded. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema } from '../common/fields.schema.js';
import { ScaffoldStatusSchema } from '../scaffolds/scaffold.schema.js';

export const ScaffoldReportsQuerySchema = z.object({
  scaffoldId: IdSchema,
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type ScaffoldReportsQuery = z.infer<typeof ScaffoldReportsQuerySchema>;

export const ScaffoldReportSchema = z.object({
  inspectionId: IdSchema,
  startedAt: DateTimeSchema,
  finishedAt: DateTimeSchema.nullable(),
  inspectorId: IdSchema,
  inspectorName: z.string(),
  reason: z.string(),
  findingsCount: z.number().int(),
  /** The scaffold status the inspection left (from its audit trail); null when none was recorded. */
  statusGiven: ScaffoldStatusSchema.nullable(),
});
export type ScaffoldReport = z.infer<typeof ScaffoldReportSchema>;

export const ScaffoldReportsSchema = z.object({
  scaffoldId: IdSchema,
  scaffoldReference: z.string(),
  siteName: z.string(),
  currentStatus: ScaffoldStatusSchema,
  /** Newest first. */
  items: z.array(ScaffoldReportSchema),
});
export type ScaffoldReports = z.infer<typeof ScaffoldReportsSchema>;
