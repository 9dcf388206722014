import PgBoss from 'pg-boss';
import type pg from 'pg';
import { HOUSEKEEPING_QUEUE } from '../../housekeeping/housekeeping-queue.js';

/** pg-boss's schema (its default): outside row-level security, granted to the application role. */
export const JOB_SCHEMA = 'pgboss';

/** The queues the mail feature uses; created with the schema so every database copy has them. */
export const MAIL_QUEUES = {
  report: 'mail-inspection-report',
  assignment: 'mail-finding-assignment',
  digest: 'mail-daily-digest',
  /** The schedule's tick: finds organisations whose digest hour has come and queues their digests. */
  digestTick: 'mail-digest-tick',
} as const;
export type MailQueueName = (typeof MAIL_QUEUES)[keyof typeof MAIL_QUEUES];
/** Every queue of this app: the mail queues and the daily purge. */
export const JOB_QUEUES = [...Object.values(MAIL_QUEUES), HOUSEKEEPING_QUEUE] as const;
export type JobQueueName = (typeof JOB_QUEUES)[number];

/**
 * pg-boss's own queue: its cron monitor sends every scheduled job (the digest tick, the purge)
 * through it. pg-boss makes it when it starts, which the application role cannot do (it may not
 * create tables in the job schema): without it made here, no schedule would ever fire.
 */
export const CRON_QUEUE = '__pgboss__send-it';

/**
 * Retries with exponential backoff (pg-boss doubles the delay each time). The defaults, 6 retries
 * from 10 s, ride out about 10 minutes of an unreachable mail server before a job ends failed.
 * Tests shorten both through MAIL_RETRY_LIMIT and MAIL_RETRY_DELAY_S.
 */
export function retryOptions(config: { MAIL_RETRY_LIMIT: number; MAIL_RETRY_DELAY_S: number }): { retryLimit: number; retryDelay: number; retryBackoff: boolean } {
  return { retryLimit: config.MAIL_RETRY_LIMIT, retryDelay: config.MAIL_RETRY_DELAY_S, retryBackoff: true };
}

/**
 * Creates (or upgrades) pg-boss's schema and our queues through a client that already holds the
 * migration lock: `npm start`, the test template and every test copy of it get the same tables,
 * and no pg-boss connection stays open on the template (a copy would then be refused).
 */
export async function ensureJobSchema(client: pg.PoolClient): Promise<void> {
  const boss = new PgBoss({
    db: { executeSql: (text, values) => client.query(text, values) },
    supervise: false,
    schedule: false,
  });
  boss.on('error', () => undefined);
  await boss.start();
  try {
    for (const name of [...JOB_QUEUES, CRON_QUEUE]) {
      if (!(await boss.getQueue(name))) await boss.createQueue(name, { name, policy: 'standard' });
    }
  } finally {
    await boss.stop({ graceful: false, wait: true });
  }
}
