import { date, pgTable, primaryKey, timestamp, uuid } from 'drizzle-orm/pg-core';
import { organisations } from './organisations.table.js';

/**
 * One row per organisation and local calendar day whose daily digest has been queued. The row is
 * written in the same transaction as the digest's mail jobs, and its key refuses a second claim:
 * however many server processes run the schedule, a day's digest goes out once.
 */
export const digestRuns = pgTable(
  'digest_runs',
  {
    organisationId: uuid('organisation_id').notNull().references(() => organisations.id, { onDelete: 'cascade' }),
    /** The day in the organisation's own time zone. */
    localDate: date('local_date', { mode: 'string' }).notNull(),
    queuedAt: timestamp('queued_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.organisationId, t.localDate] })],
);
