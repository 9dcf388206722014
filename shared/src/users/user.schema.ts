import { z } from 'zod';
import { ROLE_VALUES } from '../auth/roles.js';
import { IdSchema, NameSchema, ShortTextSchema } from '../common/fields.schema.js';
import { UNITS_VALUES, WIND_UNITS_VALUES } from './units.js';

export { defaultWindUnitsFor, UNITS_VALUES, WIND_UNITS_VALUES, type Units, type WindUnits } from './units.js';

/** An e-mail address as the service stores it: trimmed, lower-cased, at most 254 characters. */
export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .min(3)
  .max(254)
  .regex(z.regexes.email, 'Enter a valid e-mail address');

/** The signed-in user as the app shows them: who, which organisation, which role, which units. */
export const UserProfileSchema = z.object({
  id: IdSchema,
  email: z.string(),
  name: z.string(),
  position: z.string(),
  units: z.enum(UNITS_VALUES),
  windUnits: z.enum(WIND_UNITS_VALUES),
  role: z.enum(ROLE_VALUES),
  organisation: z.object({ id: IdSchema, name: z.string() }),
  /** The version of the profile and settings, the base of a phone's edit of them (absent from answers of older servers). */
  version: z.number().int().optional(),
});
export type UserProfile = z.infer<typeof UserProfileSchema>;

/** `PATCH /api/users/me`: the user's own name, position, display units and wind unit. */
export const UserProfileUpdateSchema = z
  .strictObject({
    name: NameSchema.optional(),
    position: ShortTextSchema.optional(),
    units: z.enum(UNITS_VALUES).optional(),
    windUnits: z.enum(WIND_UNITS_VALUES).optional(),
  })
  .refine((v) => Object.keys(v).length > 0, 'Send at least one field to change');
export type UserProfileUpdate = z.infer<typeof UserProfileUpdateSchema>;
