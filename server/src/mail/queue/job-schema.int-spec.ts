import { createRequire } from 'node:module';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../../../test/test-db.js';
import { CRON_QUEUE, JOB_QUEUES } from './job-schema.js';

/**
 * The server runs pg-boss as the application role, which may not create tables in the job schema,
 * so every queue it sends into must exist after the migrations: ours, and pg-boss's own cron queue
 * (without that one every schedule fails silently: no digest, no purge).
 */
let database: TestDatabase;
let boss: PgBoss;
beforeAll(async () => {
  database = await createTestDatabase();
  boss = new PgBoss({ connectionString: database.appUrl, max: 1, migrate: false, supervise: false, schedule: false });
  boss.on('error', () => undefined);
  await boss.start();
});
afterAll(async () => {
  await boss?.stop({ graceful: false, wait: true });
  await database?.drop();
});

describe('the job schema made by the migrations', () => {
  it("names pg-boss's cron queue as pg-boss itself does", () => {
    const timekeeper = createRequire(import.meta.url)('pg-boss/src/timekeeper.js') as { QUEUES: { SEND_IT: string } };
    expect(CRON_QUEUE).toBe(timekeeper.QUEUES.SEND_IT);
  });

  it.each([...JOB_QUEUES, CRON_QUEUE])('lets the application role send a job into %s', async (queue) => {
    expect(await boss.send(queue, { probe: true })).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('fires a schedule of the application role: the job reaches its queue', async () => {
    const scheduler = new PgBoss({ connectionString: database.appUrl, max: 2, migrate: false, supervise: false, cronMonitorIntervalSeconds: 1, cronWorkerIntervalSeconds: 1 });
    const errors: string[] = [];
    scheduler.on('error', (error) => errors.push(error.message));
    await scheduler.start();
    try {
      const [queue] = JOB_QUEUES;
      const before = await scheduler.getQueueSize(queue);
      // Every minute: the cron monitor sends it at once (the last slot is under a minute old).
      await scheduler.schedule(queue, '* * * * *', { scheduled: true }, { tz: 'UTC' });
      const deadline = Date.now() + 15_000;
      while ((await scheduler.getQueueSize(queue)) === before && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
      expect(errors).toEqual([]);
      expect(await scheduler.getQueueSize(queue)).toBe(before + 1);
    } finally {
      await scheduler.stop({ graceful: false, wait: true });
    }
  });
});
