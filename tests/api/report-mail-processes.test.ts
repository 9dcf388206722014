/**
 * The report e-mail with two server processes sharing one database and one mail queue: each
 * finished inspection is sent once, whichever process's worker picks the job. (The e-mail as
 * rendered and the PDF's first page are saved by the end-to-end test of the offline finish.)
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../server/test/mail-fake.js';
import { finishDemoInspection, parseEml } from '../../server/test/report-fixture.js';
import { createTestDatabase, type TestDatabase } from '../../server/test/test-db.js';
import { type RunningServer, startBuiltServer } from '../support/server.js';

describe('two server processes sharing the mail queue', () => {
  let db: TestDatabase;
  let mail: OwnMailFake;
  let first: RunningServer;
  let second: RunningServer;

  beforeAll(async () => {
    db = await createTestDatabase();
    mail = await startOwnMailFake();
    const env = { ...mail.env, MAIL_POLL_S: '0.5', MAIL_RETRY_DELAY_S: '1' };
    first = await startBuiltServer({ database: db, seed: true, env });
    second = await startBuiltServer({ database: db, seed: false, env });
  });
  afterAll(async () => {
    await first?.dispose();
    await second?.dispose();
    await db?.drop();
    await mail?.close();
  });

  async function signIn(url: string, email: string): Promise<string> {
    const res = await fetch(`${url}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password: 'plummet-demo' }) });
    return ((await res.json()) as { accessToken: string }).accessToken;
  }

  it('sends exactly one e-mail per finished inspection', async () => {
    const ids: string[] = [];
    for (let i = 0; i < 6; i++) {
      const server = i % 2 === 0 ? first : second;
      const token = await signIn(server.url, 'inspector@demo.test');
      ids.push((await finishDemoInspection(server.url, token, { findings: i === 0 })).inspectionId);
    }
    await waitForMessages(mail, ids.length);
    await new Promise((r) => setTimeout(r, 3_000));
    const names = mail.messages();
    expect(names).toHaveLength(ids.length);
    const texts = await Promise.all(names.map(async (n) => (await parseEml(mail.mailDir, n)).text ?? ''));
    for (const id of ids) expect(texts.filter((t) => t.includes(`/inspections/${id}`))).toHaveLength(1);
  });
});
