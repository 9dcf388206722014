/** A step of building-schemas.ts: what the sync pushes and pulls. */
export { SyncPullResponseSchema, SyncPushResponseSchema } from '@plummet/shared';
