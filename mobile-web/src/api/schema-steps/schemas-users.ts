/** A step of building-schemas.ts: the user's profile and the foremen. */
export { ForemanListResponseSchema, UserProfileSchema } from '@plummet/shared';
