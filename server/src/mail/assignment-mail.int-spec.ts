import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { userId } from '../../test/domain-fixtures.js';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../test/mail-fake.js';
import { finishDemoInspection, parseEml } from '../../test/report-fixture.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

describe('the e-mail to a foreman newly assigned a High finding', () => {
  let mail: OwnMailFake;
  let t: TestApp;
  beforeAll(async () => {
    mail = await startOwnMailFake();
    t = await startTestApp({ env: { ...mail.env, MAIL_RETRY_DELAY_S: '1', MAIL_POLL_S: '0.5', PUBLIC_URL: 'https://plummet.example.test' } });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('is sent once, with a deep link to the finding, and not again when the same foreman is assigned again', async () => {
    const inspector = await t.tokenFor('inspector@demo.test');
    const { findings } = await finishDemoInspection(t.baseUrl, inspector, { findings: true });
    const before = (await waitForMessages(mail, 1)).length; // the report itself
    const high = findings.find((f) => f.riskBand === 'High')!;
    const foremanId = await userId(t.drizzle, 'foreman@demo.test');
    const manager = await t.tokenFor('manager@demo.test');
    const assign = () => api(t.baseUrl, 'POST', `/findings/${high.id}/assign`, { token: manager, body: { assigneeId: foremanId } });
    expect((await assign()).status).toBe(200);
    const names = await waitForMessages(mail, before + 1);
    const message = await parseEml(mail.mailDir, names[names.length - 1]);
    expect(message.subject).toBe(`High finding assigned to you: ${high.itemName} · Quayside Library refurbishment · scaffold QL-A`);
    expect(message.text).toContain(`https://plummet.example.test/findings/${high.id}`);
    expect((message.to && !Array.isArray(message.to) ? message.to.value : []).map((a) => a.address)).toEqual(['foreman@demo.test']);

    expect((await assign()).status).toBe(200);
    await new Promise((r) => setTimeout(r, 2_000));
    expect(mail.messages()).toHaveLength(before + 1);
  });
});
