/** Sites: a construction project at one address, with its inspection regime. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, LIMITS, TimeZoneSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema } from '../common/list.schema.js';
import { JurisdictionSchema } from './jurisdiction.js';

/** `7-day`: UK WAHR 2005 reg. 12 (every 7 days); `pre-shift`: US OSHA 1926.451(f)(3) (before each shift). */
export const INSPECTION_REGIMES = ['7-day', 'pre-shift'] as const;
export const InspectionRegimeSchema = z.enum(INSPECTION_REGIMES);
export type InspectionRegime = z.infer<typeof InspectionRegimeSchema>;

export const SiteSchema = z.object({
  id: IdSchema,
  name: z.string(),
  address: z.string(),
  clientName: z.string(),
  /** Schedule 7 (UK WAHR 2005): the address of the person the report is made for. */
  clientAddress: z.string(),
  /** Receives a copy of each report (organisation setting clientCopyOfReports). */
  clientContactEmail: z.email().nullable(),
  timeZone: z.string(),
  regime: InspectionRegimeSchema,
  /** The rules the site works under: regulation references and pass criteria of the checks. */
  jurisdiction: JurisdictionSchema,
  reportRecipients: z.array(z.string()),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Site = z.infer<typeof SiteSchema>;

const requiredName = (message: string) =>
  z.string().trim().min(1, message).max(LIMITS.nameMax, `At most ${LIMITS.nameMax} characters`);

const EmailField = z.email('An e-mail address, e.g. name@example.com').max(254, 'At most 254 characters');

const siteFields = {
  name: requiredName('Give the site a name'),
  address: z.string().trim().min(1, 'Give the address of the site').max(500, 'At most 500 characters'),
  clientName: requiredName('Say whom the inspections are for'),
  clientAddress: z.string().trim().max(500, 'At most 500 characters'),
  clientContactEmail: EmailField.nullable(),
  timeZone: TimeZoneSchema,
  regime: z.enum(INSPECTION_REGIMES, 'Every 7 days or before each shift'),
  jurisdiction: z.enum(JurisdictionSchema.options, 'UK or US'),
  reportRecipients: z.array(EmailField).max(20, 'At most 20 recipients'),
};

export const SiteCreateSchema = z.object({
  ...siteFields,
  timeZone: siteFields.timeZone.default('Europe/London'),
  regime: siteFields.regime.default('7-day'),
  jurisdiction: siteFields.jurisdiction.default('uk'),
  reportRecipients: siteFields.reportRecipients.default([]),
  clientAddress: siteFields.clientAddress.default(''),
  clientContactEmail: siteFields.clientContactEmail.default(null),
});
export type SiteCreate = z.infer<typeof SiteCreateSchema>;

export const SiteUpdateSchema = z
  .object({ ...z.object(siteFields).partial().shape, version: VersionSchema.optional() })
  .refine((v) => Object.keys(v).some((k) => k !== 'version'), 'Nothing to change');
export type SiteUpdate = z.infer<typeof SiteUpdateSchema>;

export const SiteListQuerySchema = z.object({
  ...listQueryShape(['name', 'createdAt', 'updatedAt'], 'name', 'asc'),
  regime: InspectionRegimeSchema.optional(),
  jurisdiction: JurisdictionSchema.optional(),
});
export type SiteListQuery = z.infer<typeof SiteListQuerySchema>;

export const SiteListResponseSchema = listResponseSchema(SiteSchema);
