/** A step of building-schemas.ts: the organisation's settings. */
export { OrganisationSettingsSchema } from '@plummet/shared';
