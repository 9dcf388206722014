import { randomUUID } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HOUSEKEEPING_CRON, HOUSEKEEPING_QUEUE } from '../housekeeping/housekeeping-queue.js';
import { memberships, refreshTokens, users } from '../db/schema/index.js';
import { MailJobsService } from '../mail/queue/mail-jobs.service.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('the daily purge through the job queue', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ env: { MAIL_POLL_S: '0.5' } });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('is scheduled once a day in UTC in PostgreSQL, so one replica runs it', async () => {
    const purge = await t.drizzle.execute<{ cron: string; timezone: string }>(sql`SELECT cron, timezone FROM pgboss.schedule WHERE name = ${HOUSEKEEPING_QUEUE}`);
    expect(purge.rows).toEqual([{ cron: HOUSEKEEPING_CRON, timezone: 'UTC' }]);
  });

  it('purges expired refresh tokens when its job runs, and keeps live ones', async () => {
    const [user] = await t.drizzle.select({ id: users.id, org: memberships.organisationId }).from(users)
      .innerJoin(memberships, eq(memberships.userId, users.id)).where(eq(users.email, 'foreman@demo.test'));
    const family = randomUUID();
    const hour = 3_600_000;
    await t.drizzle.insert(refreshTokens).values([
      { userId: user.id, organisationId: user.org, familyId: family, tokenHash: `old-${family}`, expiresAt: new Date(Date.now() - hour) },
      { userId: user.id, organisationId: user.org, familyId: family, tokenHash: `live-${family}`, expiresAt: new Date(Date.now() + hour) },
    ]);
    // What the cron monitor does at 03:17 UTC: put one job in the queue.
    const jobId = await t.app.get(MailJobsService).queue.send(HOUSEKEEPING_QUEUE, {});
    expect(jobId).toBeTruthy();
    const deadline = Date.now() + 20_000;
    let state = '';
    while (state !== 'completed' && Date.now() < deadline) {
      await sleep(250);
      const rows = await t.drizzle.execute<{ state: string }>(sql`SELECT state FROM pgboss.job WHERE id = ${jobId}`);
      state = rows.rows[0]?.state ?? '';
    }
    expect(state).toBe('completed');
    const left = await t.drizzle.select({ hash: refreshTokens.tokenHash }).from(refreshTokens).where(eq(refreshTokens.familyId, family));
    expect(left.map((r) => r.hash)).toEqual([`live-${family}`]);
  });
});
