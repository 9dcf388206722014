/** Trends of findings over time, computed in SQL: raised and closed per week, time to fix, repeat locations. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema } from '../common/fields.schema.js';
import { RiskBandSchema } from '../findings/finding.schema.js';

export const TrendsQuerySchema = z.object({
  siteId: IdSchema.optional(),
  /** How many whole weeks back (ISO weeks, Monday first, UTC), this week included. */
  weeks: z.coerce.number().int().min(1).max(104).default(12),
});
export type TrendsQuery = z.infer<typeof TrendsQuerySchema>;

/** Findings raised and closed (verified) in one week, by band. */
export const TrendsWeekSchema = z.object({
  /** Monday 00:00 UTC of the week. */
  weekStart: DateTimeSchema,
  raised: z.object({ Low: z.number().int(), Medium: z.number().int(), High: z.number().int() }),
  closed: z.object({ Low: z.number().int(), Medium: z.number().int(), High: z.number().int() }),
});
export type TrendsWeek = z.infer<typeof TrendsWeekSchema>;

/** Median time from raising a finding to its first fix, for fixes within the period; null with no fix. */
export const TimeToFixSchema = z.object({ band: RiskBandSchema, medianHours: z.number().nullable(), fixes: z.number().int() });
export type TimeToFix = z.infer<typeof TimeToFixSchema>;

/** The same scaffold, lift and bay with REPEAT_LOCATION_MIN findings or more raised in REPEAT_LOCATION_DAYS days. */
export const RepeatLocationSchema = z.object({
  scaffoldId: IdSchema,
  scaffoldReference: z.string(),
  siteName: z.string(),
  lift: z.number().int(),
  bay: z.number().int(),
  /** The elevations the findings were on (a bay number repeats on every face). */
  elevations: z.array(z.string()),
  findings: z.number().int(),
  lastRaisedAt: DateTimeSchema,
});
export type RepeatLocation = z.infer<typeof RepeatLocationSchema>;

export const REPEAT_LOCATION_MIN = 3;
export const REPEAT_LOCATION_DAYS = 30;

export const TrendsSchema = z.object({
  generatedAt: DateTimeSchema,
  siteId: IdSchema.nullable(),
  /** Oldest first, every week of the period (zeros included). */
  weeks: z.array(TrendsWeekSchema),
  timeToFix: z.array(TimeToFixSchema),
  repeatLocations: z.array(RepeatLocationSchema),
});
export type Trends = z.infer<typeof TrendsSchema>;
