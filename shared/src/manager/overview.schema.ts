/** The managers' overview: counts computed by SQL aggregates on the server, per organisation and per site. */
import { z } from 'zod';
import { DateTimeSchema, IdSchema } from '../common/fields.schema.js';
import { ROLE_VALUES } from '../auth/roles.js';
import { ScaffoldStatusSchema } from '../scaffolds/scaffold.schema.js';

export const OverviewQuerySchema = z.object({
  /** Only this site (the per-site view); absent for the whole organisation. */
  siteId: IdSchema.optional(),
});
export type OverviewQuery = z.infer<typeof OverviewQuerySchema>;

/** Findings still to fix (open or made safe), by band. */
export const OpenByBandSchema = z.object({ Low: z.number().int(), Medium: z.number().int(), High: z.number().int() });
export type OpenByBand = z.infer<typeof OpenByBandSchema>;

/** The numbers of one scope (the organisation or one site). */
export const OverviewFiguresSchema = z.object({
  openByBand: OpenByBandSchema,
  /** Open or made safe and past the due time of the permanent fix. */
  overdueFixes: z.number().int(),
  /** Fixed, waiting for someone other than the fixer to verify. */
  waitingVerification: z.number().int(),
  /** Every scaffold status with its count (zero included). */
  scaffoldsByStatus: z.array(z.object({ status: ScaffoldStatusSchema, count: z.number().int() })),
  /** Scaffolds whose next inspection falls later today (in the site's time zone). */
  inspectionsDueToday: z.number().int(),
  /** Scaffolds whose next inspection is past. */
  inspectionsOverdue: z.number().int(),
  /** Sync conflicts nobody has settled yet (organisation-wide; per site those on its findings). */
  openConflicts: z.number().int(),
});
export type OverviewFigures = z.infer<typeof OverviewFiguresSchema>;

export const OverviewSiteSchema = OverviewFiguresSchema.extend({ siteId: IdSchema, siteName: z.string() });
export type OverviewSite = z.infer<typeof OverviewSiteSchema>;

export const OverviewSchema = z.object({
  generatedAt: DateTimeSchema,
  /** The site asked for, or null for the organisation. */
  siteId: IdSchema.nullable(),
  totals: OverviewFiguresSchema,
  /** One entry per site of the scope, by name. */
  sites: z.array(OverviewSiteSchema),
});
export type Overview = z.infer<typeof OverviewSchema>;

/** GET /overview/people: the organisation's active members by name, for assigning and for names in the tables. */
export const PersonSchema = z.object({ id: IdSchema, name: z.string(), role: z.enum(ROLE_VALUES) });
export type Person = z.infer<typeof PersonSchema>;
export const PeopleSchema = z.object({ items: z.array(PersonSchema) });
