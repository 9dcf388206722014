/** Sites: a construction project at one address, with its inspection regime. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema, NameSchema, TimeZoneSchema, VersionSchema } from '../common/fields.schema.js';
import { listQueryShape, listResponseSchema } from '../common/list.schema.js';

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
  reportRecipients: z.array(z.string()),
  createdAt: DateTimeSchema,
  updatedAt: DateTimeSchema,
  version: z.number().int(),
});
export type Site = z.infer<typeof SiteSchema>;

const siteFields = {
  name: NameSchema,
  address: z.string().trim().min(1).max(500),
  clientName: NameSchema,
  clientAddress: z.string().trim().max(500),
  clientContactEmail: z.email().max(254).nullable(),
  timeZone: TimeZoneSchema,
  regime: InspectionRegimeSchema,
  reportRecipients: z.array(z.email().max(254)).max(20),
};

export const SiteCreateSchema = z.object({
  ...siteFields,
  timeZone: siteFields.timeZone.default('Europe/London'),
  regime: siteFields.regime.default('7-day'),
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
});
export type SiteListQuery = z.infer<typeof SiteListQuerySchema>;

export const SiteListResponseSchema = listResponseSchema(SiteSchema);
