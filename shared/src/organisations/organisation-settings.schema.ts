/**
 * Organisation settings: one schema for the server (stored as jsonb on the organisation, read
 * through `readOrganisationSettings`) and the settings form (a clear message per field).
 */
import { z } from 'zod';
import { TimeZoneSchema } from '../common/fields.schema.js';
import { UNITS_VALUES } from '../users/user.schema.js';

const LocalTimeSchema = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'A time of day as HH:MM, e.g. 17:00');

/**
 * Hours to a permanent fix per band. Defaults are common practice, no source: High within a
 * day, Medium within three; Low is due before the scaffold's next inspection.
 */
export const FixDueHoursSchema = z.object({
  High: z.number().int('Whole hours').min(1, 'At least 1 hour').max(24 * 14, 'At most 14 days'),
  Medium: z.number().int('Whole hours').min(1, 'At least 1 hour').max(24 * 60, 'At most 60 days'),
});

/** Each setting without its default (the update form sends only what changed). */
const settingsFields = {
  fixDueHours: FixDueHoursSchema,
  /** A High finding needs a proof photo to be marked made safe or fixed. */
  proofPhotoRequiredForHigh: z.boolean(),
  /** Separation of duties: whoever marked a finding fixed cannot verify it. */
  verifierMustDifferFromFixer: z.boolean(),
  /** A made-safe measure lapses at this local time unless renewed (common practice, no source). */
  shiftEndsAt: LocalTimeSchema,
  /** The organisation's time zone: shift ends, the daily digest, dates in e-mails and reports. */
  timeZone: TimeZoneSchema,
  /** Local hour of the daily digest to managers and foremen. */
  digestHour: z.number().int('A whole hour').min(0, 'From 0').max(23, 'To 23'),
  /**
   * Send the client contact a copy of each report. On by default: under UK WAHR 2005 reg. 12 and
   * Schedule 7 the report goes to the person it was made for within 24 hours.
   */
  clientCopyOfReports: z.boolean(),
  /** Keep the GPS position of photos (stripped by default). */
  keepPhotoLocation: z.boolean(),
  /** Units new members start with. */
  defaultUnits: z.enum(UNITS_VALUES),
};

export const OrganisationSettingsSchema = z.object({
  fixDueHours: settingsFields.fixDueHours.default({ High: 24, Medium: 72 }),
  proofPhotoRequiredForHigh: settingsFields.proofPhotoRequiredForHigh.default(true),
  verifierMustDifferFromFixer: settingsFields.verifierMustDifferFromFixer.default(true),
  shiftEndsAt: settingsFields.shiftEndsAt.default('17:00'),
  timeZone: settingsFields.timeZone.default('Europe/London'),
  digestHour: settingsFields.digestHour.default(6),
  clientCopyOfReports: settingsFields.clientCopyOfReports.default(true),
  keepPhotoLocation: settingsFields.keepPhotoLocation.default(false),
  defaultUnits: settingsFields.defaultUnits.default('si'),
  /** An organisation's own severity bands (checked with validateSeverityTable); absent: Plummet's defaults. */
  severityTable: z.unknown().optional(),
});
export type OrganisationSettings = z.infer<typeof OrganisationSettingsSchema>;
export type OrganisationSettingsInput = z.input<typeof OrganisationSettingsSchema>;

/** A partial change from the settings form; `severityTable: null` puts Plummet's default bands back. */
export const OrganisationSettingsUpdateSchema = z
  .object({ ...z.object(settingsFields).partial().shape, severityTable: z.unknown().optional() })
  .strict()
  .refine((v) => Object.keys(v).length > 0, 'Nothing to change');
export type OrganisationSettingsUpdate = z.infer<typeof OrganisationSettingsUpdateSchema>;

export const DEFAULT_ORGANISATION_SETTINGS: OrganisationSettings = OrganisationSettingsSchema.parse({});

/**
 * The settings stored on an organisation, with defaults for what is missing. A stored value that
 * no longer validates falls back to its default rather than breaking every route that reads it.
 */
export function readOrganisationSettings(stored: unknown): OrganisationSettings {
  const source = typeof stored === 'object' && stored !== null ? (stored as Record<string, unknown>) : {};
  const parsed = OrganisationSettingsSchema.safeParse(source);
  if (parsed.success) return parsed.data;
  const kept: Record<string, unknown> = {};
  const shape = OrganisationSettingsSchema.shape;
  for (const key of Object.keys(shape) as (keyof typeof shape)[]) {
    const one = shape[key].safeParse(source[key]);
    if (one.success && source[key] !== undefined) kept[key] = one.data;
  }
  return OrganisationSettingsSchema.parse(kept);
}
