/** The job queue of the daily purge; created with the schema (job-schema.ts) like the mail queues. */
export const HOUSEKEEPING_QUEUE = 'housekeeping-purge';

/**
 * Once a day at 03:17 UTC, a quiet hour for site work in most time zones. pg-boss keeps one
 * schedule per queue in PostgreSQL and its cron monitor enqueues one job per tick, whatever the
 * number of replicas, so the purge runs once a day on one of them.
 */
export const HOUSEKEEPING_CRON = '17 3 * * *';
