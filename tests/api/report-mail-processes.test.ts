/**
 * The report e-mail with two server processes sharing one database and one mail queue: each
 * finished inspection is sent once, whichever process's worker picks the job. Also saves what a
 * person would look at: the e-mail's HTML rendered in Chromium and the PDF's first page.
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type OwnMailFake, startOwnMailFake, waitForMessages } from '../../server/test/mail-fake.js';
import { finishDemoInspection, parseEml } from '../../server/test/report-fixture.js';
import { createTestDatabase, type TestDatabase } from '../../server/test/test-db.js';
import { artifactPath, launchBrowser } from '../support/browser.js';
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

  it('renders the e-mail in Chromium and the PDF’s first page as images to look at', async () => {
    let withFindings: Awaited<ReturnType<typeof parseEml>> | undefined;
    for (const n of mail.messages()) {
      const m = await parseEml(mail.mailDir, n);
      if (String(m.html).includes('Findings, highest risk first')) withFindings = m;
    }
    expect(withFindings).toBeDefined();
    const pdf = withFindings!.attachments.find((a) => a.contentType === 'application/pdf')!.content;
    const base = artifactPath('report-page-1');
    execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '1', '-singlefile', '-', base], { input: pdf });
    expect(readFileSync(`${base}.png`).subarray(1, 4).toString()).toBe('PNG');

    // Inline images by cid, as a mail program shows them: data URLs for the browser.
    let html = String(withFindings!.html);
    for (const a of withFindings!.attachments.filter((x) => x.cid)) html = html.split(`cid:${a.cid}`).join(`data:${a.contentType};base64,${a.content.toString('base64')}`);
    const browser = await launchBrowser();
    try {
      const page = await browser.newPage({ viewport: { width: 760, height: 900 } });
      await page.setContent(html);
      await page.screenshot({ path: artifactPath('findings-email.png'), fullPage: true });
      expect(await page.locator('img[alt^="Photo of"]').count()).toBe(1);
    } finally {
      await browser.close();
    }
  });
});
