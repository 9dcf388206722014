/** The exclusion zone of each elevation of a scaffold, as the API shapes it. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, WindSpeedMpsSchema } from '../common/fields.schema.js';

/** Body of PUT /scaffolds/:id/exclusion-zones/:elevation. */
export const ExclusionZonePutSchema = z.object({
  /** The heaviest item handled at the elevation, from the catalogue (built in or the organisation's). */
  heaviestItemId: IdSchema.nullable(),
  /** Wind speed up to which the site works at height, m/s. */
  limitingWindMps: WindSpeedMpsSchema.nullable(),
  /** The width the site actually barriers, out from the face, m (0–100). */
  barrieredWidthM: z.number().min(0).max(100).nullable(),
});
export type ExclusionZonePut = z.infer<typeof ExclusionZonePutSchema>;

export const ExclusionZoneSuggestionSchema = z.object({
  driftM: z.number(),
  bounceAllowanceM: z.number(),
  suggestedWidthM: z.number(),
  rulesOfThumb: z.array(z.object({ label: z.string(), widthM: z.number().nullable(), source: z.string() })),
  basis: z.string(),
  caution: z.string(),
});

export const ExclusionZoneSchema = z.object({
  scaffoldId: IdSchema,
  elevation: z.string(),
  /** Height of the top working platform above the ground, m. */
  topWorkingHeightM: z.number(),
  heaviestItem: z.object({ id: IdSchema, name: z.string(), massKg: z.number() }).nullable(),
  limitingWindMps: z.number().nullable(),
  barrieredWidthM: z.number().nullable(),
  /** Null until an item and a wind speed are set. */
  suggestion: ExclusionZoneSuggestionSchema.nullable(),
  updatedAt: DateTimeSchema.nullable(),
});
export type ExclusionZone = z.infer<typeof ExclusionZoneSchema>;

export const ExclusionZoneListSchema = z.object({ items: z.array(ExclusionZoneSchema) });
export type ExclusionZoneList = z.infer<typeof ExclusionZoneListSchema>;
