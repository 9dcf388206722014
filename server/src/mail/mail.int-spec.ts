import { CAUTION_TEXT } from '@plummet/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { decodeQuotedPrintable, useMailFake, waitForMail, type MailFake } from '../../test/mail-fake.js';
import { api } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

describe('GET /api/mail: the development view of the SMTP fake’s captured messages', () => {
  let t: TestApp;
  let mail: MailFake;
  let admin: string;
  const stamp = Date.now();
  const first = `mail-first.${stamp}@demo.test`;
  const second = `mail-second.${stamp}@demo.test`;
  let firstName: string;
  let secondName: string;

  beforeAll(async () => {
    mail = await useMailFake();
    t = await startTestApp({ env: mail.env });
    admin = await t.tokenFor('admin@demo.test');
    await api(t.baseUrl, 'POST', '/users/invitations', { token: admin, body: { email: first, name: 'Mail First', role: 'inspector' } });
    firstName = (await waitForMail(mail.mailDir, first)).name;
    // File times order the list; keep the two messages apart on coarse file systems.
    await new Promise((r) => setTimeout(r, 20));
    await api(t.baseUrl, 'POST', '/users/invitations', { token: admin, body: { email: second, name: 'Mail Second', role: 'foreman' } });
    secondName = (await waitForMail(mail.mailDir, second)).name;
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('lists captured messages newest first with subject, recipient and date', async () => {
    const res = await api(t.baseUrl, 'GET', '/mail?limit=200', { token: admin });
    expect(res.status).toBe(200);
    const names = res.body.items.map((m: { name: string }) => m.name);
    expect(names.indexOf(secondName)).toBeGreaterThanOrEqual(0);
    expect(names.indexOf(secondName)).toBeLessThan(names.indexOf(firstName));
    const item = res.body.items[names.indexOf(secondName)];
    expect(item.subject).toBe('You are invited to Plummet by Harrow & Span Access Ltd');
    expect(item.to).toContain(second);
    expect(new Date(item.date).getTime()).toBeGreaterThan(stamp - 60_000);
  });

  it('pages through the messages with a cursor, without repeats', async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const query: string = cursor ? `limit=1&cursor=${encodeURIComponent(cursor)}` : 'limit=1';
      const page = await api(t.baseUrl, 'GET', `/mail?${query}`, { token: admin });
      expect(page.status).toBe(200);
      expect(page.body.items.length).toBeLessThanOrEqual(1);
      seen.push(...page.body.items.map((m: { name: string }) => m.name));
      cursor = page.body.nextCursor;
    } while (cursor && seen.length < 500);
    expect(new Set(seen).size).toBe(seen.length);
    expect(seen).toEqual(expect.arrayContaining([firstName, secondName]));
  });

  it('returns a message’s raw text, whose text and HTML parts both end with the caution', async () => {
    const res = await api(t.baseUrl, 'GET', `/mail/${secondName}`, { token: admin });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/plain/);
    expect(res.body).toMatch(/^Subject: /m);
    const decoded = decodeQuotedPrintable(res.body);
    const [textPart, htmlPart] = decoded.split(/Content-Type: text\/html/i);
    expect(textPart).toContain(CAUTION_TEXT);
    expect(htmlPart).toContain(CAUTION_TEXT);
  });

  it('refuses names that could reach outside the folder', async () => {
    for (const name of ['..%2F..%2F..%2Fetc%2Fpasswd', '..%2Fpackage.json', '%2Fetc%2Fpasswd', '.hidden.eml', 'a..b.eml', 'message.txt', '..%5C..%5Cwin.ini']) {
      const res = await api(t.baseUrl, 'GET', `/mail/${name}`, { token: admin });
      expect([400, 404], name).toContain(res.status);
      expect(res.body.code).toMatch(/^(VALIDATION_FAILED|NOT_FOUND)$/);
      expect(JSON.stringify(res.body)).not.toContain('root:');
    }
  });

  it('refuses a forged cursor with 400', async () => {
    const res = await api(t.baseUrl, 'GET', '/mail?cursor=not-a-cursor', { token: admin });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('VALIDATION_FAILED');
  });
});

describe('GET /api/mail without MAIL_DIR', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp({ env: { MAIL_DIR: '' } });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('answers 404 NOT_FOUND: there is nothing captured to show', async () => {
    const token = await t.tokenFor('admin@demo.test');
    for (const path of ['/mail', '/mail/anything.eml']) {
      const res = await api(t.baseUrl, 'GET', path, { token });
      expect(res.status).toBe(404);
      expect(res.body.code).toBe('NOT_FOUND');
    }
  });
});

describe('GET /api/mail keeps organisations apart', () => {
  it('shows an admin only the messages of their own organisation', async () => {
    const mail = await useMailFake();
    const t = await startTestApp({ env: mail.env });
    try {
      const { addOtherOrgRoles } = await import('../../test/fixtures.js');
      await addOtherOrgRoles(t.drizzle);
      const address = `mail-scope.${Date.now()}@demo.test`;
      await api(t.baseUrl, 'POST', '/users/invitations', { token: await t.tokenFor('admin@demo.test'), body: { email: address, name: 'Mail Scope', role: 'inspector' } });
      const { name } = await waitForMail(mail.mailDir, address);
      const other = await t.tokenFor('admin@other.test');
      const list = await api(t.baseUrl, 'GET', '/mail?limit=200', { token: other });
      expect(list.status).toBe(200);
      expect(list.body.items.map((m: { name: string }) => m.name)).not.toContain(name);
      expect((await api(t.baseUrl, 'GET', `/mail/${name}`, { token: other })).status).toBe(404);
      expect((await api(t.baseUrl, 'GET', `/mail/${name}`, { token: await t.tokenFor('admin@demo.test') })).status).toBe(200);
    } finally {
      await t.close();
      await mail.close();
    }
  });

  it('files a password-reset e-mail under the account’s organisation, so that organisation’s admin sees it', async () => {
    // Its own fake: other test files also send reset mails to the demo foreman.
    const mail = await useMailFake({ own: true });
    const t = await startTestApp({ env: mail.env });
    try {
      const { addOtherOrgRoles } = await import('../../test/fixtures.js');
      await addOtherOrgRoles(t.drizzle);
      expect((await api(t.baseUrl, 'POST', '/auth/password-reset', { body: { email: 'foreman@demo.test' } })).status).toBe(202);
      const { name } = await waitForMail(mail.mailDir, 'foreman@demo.test', '/reset-password');
      const own = await api(t.baseUrl, 'GET', '/mail?limit=200', { token: await t.tokenFor('admin@demo.test') });
      expect(own.body.items.map((m: { name: string }) => m.name)).toContain(name);
      const other = await api(t.baseUrl, 'GET', '/mail?limit=200', { token: await t.tokenFor('admin@other.test') });
      expect(other.body.items.map((m: { name: string }) => m.name)).not.toContain(name);
    } finally {
      await t.close();
      await mail.close();
    }
  });
});
