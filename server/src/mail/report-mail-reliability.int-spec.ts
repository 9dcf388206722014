import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addOtherOrgRoles } from '../../test/fixtures.js';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../test/mail-fake.js';
import { finishDemoInspection } from '../../test/report-fixture.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function jobStates(t: TestApp): Promise<string[]> {
  const result = await t.drizzle.execute(sql`select state from pgboss.job where name = 'mail-inspection-report' order by created_on`);
  return result.rows.map((r) => String((r as { state: string }).state));
}

async function waitForState(t: TestApp, state: string, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await jobStates(t)).includes(state)) {
    if (Date.now() > deadline) throw new Error(`no job reached ${state}: ${(await jobStates(t)).join(', ')}`);
    await sleep(200);
  }
}

describe('a report e-mail while the mail server is down', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ env: { ...mail.env, MAIL_RETRY_DELAY_S: '1', MAIL_POLL_S: '0.5' } });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('is retried with backoff and arrives exactly once when the mail server is back', async () => {
    await mail.stop();
    await finishDemoInspection(t.baseUrl, await t.tokenFor('inspector@demo.test'), { findings: false });
    await waitForState(t, 'retry');
    expect(mail.messages()).toHaveLength(0);
    await mail.start();
    expect(await waitForMessages(mail, 1)).toHaveLength(1);
    await waitForState(t, 'completed');
    await sleep(2_000);
    expect(mail.messages()).toHaveLength(1);
  });
});

describe('a report e-mail that keeps failing', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ env: { ...mail.env, MAIL_RETRY_DELAY_S: '1', MAIL_RETRY_LIMIT: '1', MAIL_POLL_S: '0.5' } });
    await addOtherOrgRoles(t.drizzle);
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('ends failed, is listed for the admin of its organisation only, and is sent when the admin retries it', async () => {
    await mail.stop();
    const { inspectionId } = await finishDemoInspection(t.baseUrl, await t.tokenFor('inspector@demo.test'), { findings: false });
    await waitForState(t, 'failed');
    const admin = await t.tokenFor('admin@demo.test');
    const list = await api(t.baseUrl, 'GET', '/mail-jobs/failed', { token: admin });
    expect(list.status).toBe(200);
    expect(list.body.items).toHaveLength(1);
    expect(list.body.items[0]).toMatchObject({ kind: 'inspection-report', recordId: inspectionId, attempts: 2 });
    expect(list.body.items[0].error).toBeTruthy();
    // What the e-mail was and to whom, so the admin can tell which one to retry.
    expect(list.body.items[0].subject).toMatch(/ · scaffold .+ · 0 High findings$/);
    expect(list.body.items[0].recipients).toContain('manager@demo.test');

    expect((await api(t.baseUrl, 'GET', '/mail-jobs/failed', { token: await t.tokenFor('manager@demo.test') })).status).toBe(403);
    const jobId = list.body.items[0].id as string;
    expect((await api(t.baseUrl, 'POST', `/mail-jobs/${jobId}/retry`, { token: await t.tokenFor('admin@other.test') })).status).toBe(404);

    await mail.start();
    const retried = await api(t.baseUrl, 'POST', `/mail-jobs/${jobId}/retry`, { token: admin });
    expect(retried.status).toBe(202);
    expect(await waitForMessages(mail, 1)).toHaveLength(1);
    expect((await api(t.baseUrl, 'GET', '/mail-jobs/failed', { token: admin })).body.items).toHaveLength(0);
  });
});
