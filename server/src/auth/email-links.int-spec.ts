import { CAUTION_TEXT } from '@plummet/shared';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailTokens, users } from '../db/schema/index.js';
import { addOtherOrgRoles } from '../../test/fixtures.js';
import { freePortForTest } from '../../test/free-port.js';
import { linkToken, useMailFake, waitForMail, type MailFake } from '../../test/mail-fake.js';
import { accountTablesDigest, api } from '../../test/request.js';
import { signIn } from '../../test/sign-in.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

describe('invitations and password resets by e-mail link', () => {
  let t: TestApp;
  let mail: MailFake;
  let adminToken: string;
  const post = (path: string, body: unknown, token?: string) => api(t.baseUrl, 'POST', path, { body, token });

  beforeAll(async () => {
    mail = await useMailFake();
    t = await startTestApp({ env: { ...mail.env, PUBLIC_URL: 'https://plummet.example.test' } });
    await addOtherOrgRoles(t.drizzle);
    adminToken = (await signIn(t.baseUrl, 'admin@demo.test')).accessToken;
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('invites a user: the e-mail arrives with a working link, accepting signs them in, and the password then works', async () => {
    const email = `new.inspector.${Date.now()}@demo.test`;
    const invited = await post('/users/invitations', { email, name: 'Nia Brook', role: 'inspector' }, adminToken);
    expect(invited.status).toBe(201);
    expect(invited.body).toMatchObject({ email, name: 'Nia Brook', role: 'inspector', active: true, invitationPending: true });

    const message = await waitForMail(mail.mailDir, email, 'accept-invite');
    expect(message.name).toMatch(/\.eml$/);
    expect(message.decoded).toContain('Subject: You are invited to Plummet by Harrow & Span Access Ltd');
    expect(message.decoded).toContain('https://plummet.example.test/accept-invite?token=');
    // Caution in the text part and in the HTML part.
    expect(message.decoded.split(CAUTION_TEXT).length - 1).toBeGreaterThanOrEqual(2);
    const token = linkToken(message.decoded, 'accept-invite');

    const [stored] = await t.drizzle.select().from(emailTokens).where(eq(emailTokens.userId, invited.body.id));
    expect(stored.tokenHash).not.toContain(token);
    expect(stored.expiresAt.getTime() - Date.now()).toBeGreaterThan(6.9 * 86_400_000);

    expect((await post('/auth/sign-in', { email, password: 'a-new-password-1' })).status).toBe(401);
    const accepted = await post('/auth/accept-invite', { token, password: 'a-new-password-1' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user).toMatchObject({ email, role: 'inspector', organisation: { name: 'Harrow & Span Access Ltd' } });
    expect((await api(t.baseUrl, 'GET', '/users/me', { token: accepted.body.accessToken })).body.email).toBe(email);

    const again = await post('/auth/accept-invite', { token, password: 'another-password-2' });
    expect(again.status).toBe(401);
    expect(again.body.code).toBe('UNAUTHENTICATED');

    const session = await signIn(t.baseUrl, email, 'a-new-password-1');
    expect(session.user.role).toBe('inspector');
    const list = await api(t.baseUrl, 'GET', '/users?limit=200', { token: adminToken });
    expect(list.body.items.find((m: { email: string }) => m.email === email)).toMatchObject({ invitationPending: false });
  });

  it('renews a pending invitation: the newer link works and the older one does not', async () => {
    const email = `renewed.${Date.now()}@demo.test`;
    await post('/users/invitations', { email, name: 'First Name', role: 'foreman' }, adminToken);
    const firstToken = linkToken((await waitForMail(mail.mailDir, email, 'accept-invite')).decoded, 'accept-invite');
    const renewed = await post('/users/invitations', { email, name: 'Second Name', role: 'manager' }, adminToken);
    expect(renewed.status).toBe(201);
    expect(renewed.body).toMatchObject({ name: 'Second Name', role: 'manager', invitationPending: true });
    let secondToken = firstToken;
    for (let i = 0; i < 100 && secondToken === firstToken; i++) {
      secondToken = linkToken((await waitForMail(mail.mailDir, email, 'accept-invite')).decoded, 'accept-invite');
      if (secondToken === firstToken) await new Promise((r) => setTimeout(r, 50));
    }
    expect(secondToken).not.toBe(firstToken);
    expect((await post('/auth/accept-invite', { token: firstToken, password: 'renewed-password' })).status).toBe(401);
    const accepted = await post('/auth/accept-invite', { token: secondToken, password: 'renewed-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.role).toBe('manager');
  });

  it('refuses to invite an e-mail that already has an account, and writes nothing', async () => {
    const before = await accountTablesDigest(t.drizzle);
    const res = await post('/users/invitations', { email: 'manager@other.test', name: 'Ruth', role: 'inspector' }, adminToken);
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('CONFLICT');
    expect(await accountTablesDigest(t.drizzle)).toEqual(before);
  });

  it('refuses an expired invitation link', async () => {
    const email = `late.${Date.now()}@demo.test`;
    const invited = await post('/users/invitations', { email, name: 'Late Comer', role: 'inspector' }, adminToken);
    const token = linkToken((await waitForMail(mail.mailDir, email, 'accept-invite')).decoded, 'accept-invite');
    await t.drizzle.update(emailTokens).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(emailTokens.userId, invited.body.id));
    expect((await post('/auth/accept-invite', { token, password: 'too-late-password' })).status).toBe(401);
  });

  it('applies the password policy when accepting: 10 to 200 characters', async () => {
    const token = 'C'.repeat(43);
    expect((await post('/auth/accept-invite', { token, password: '123456789' })).status).toBe(400);
    expect((await post('/auth/accept-invite', { token, password: 'x'.repeat(201) })).status).toBe(400);
    expect((await post('/auth/accept-invite', { token, password: 'x'.repeat(10) })).status).toBe(401);
  });

  it('resets a password by e-mail link: the old password and sessions stop working, the link works once', async () => {
    const oldSession = await signIn(t.baseUrl, 'inspector@other.test');
    const requested = await post('/auth/password-reset', { email: 'Inspector@Other.test' });
    expect(requested.status).toBe(202);
    const message = await waitForMail(mail.mailDir, 'inspector@other.test', 'reset-password');
    expect(message.decoded).toContain(CAUTION_TEXT);
    const token = linkToken(message.decoded, 'reset-password');

    expect((await post('/auth/password-reset/confirm', { token, password: 'short' })).status).toBe(400);
    const confirmed = await post('/auth/password-reset/confirm', { token, password: 'a-brand-new-password' });
    expect(confirmed.status).toBe(204);
    expect((await post('/auth/refresh', { refreshToken: oldSession.refreshToken })).status).toBe(401);
    expect((await post('/auth/sign-in', { email: 'inspector@other.test', password: 'plummet-demo' })).status).toBe(401);
    expect((await signIn(t.baseUrl, 'inspector@other.test', 'a-brand-new-password')).user.email).toBe('inspector@other.test');
    expect((await post('/auth/password-reset/confirm', { token, password: 'yet-another-password' })).status).toBe(401);
  });

  it('answers 202 with the same body for an unknown address and stores no link for it', async () => {
    const known = await post('/auth/password-reset', { email: 'foreman@demo.test' });
    const before = await t.drizzle.select().from(emailTokens);
    const unknown = await post('/auth/password-reset', { email: 'no-such-person@demo.test' });
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(await t.drizzle.select().from(emailTokens)).toHaveLength(before.length);
  });

  it('sends no reset link to a deactivated account', async () => {
    await t.drizzle.update(users).set({ active: false }).where(eq(users.email, 'foreman@other.test'));
    const before = await t.drizzle.select().from(emailTokens);
    expect((await post('/auth/password-reset', { email: 'foreman@other.test' })).status).toBe(202);
    expect(await t.drizzle.select().from(emailTokens)).toHaveLength(before.length);
  });
});

describe('an invitation while the mail server is unreachable', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await startTestApp({ env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(await freePortForTest()) } });
  });
  afterAll(async () => {
    await t?.close();
  });

  it('answers 503 SERVICE_UNAVAILABLE after the commit: the invitation stays pending and inviting again renews it', async () => {
    const adminToken = await t.tokenFor('admin@demo.test');
    const invite = () =>
      api(t.baseUrl, 'POST', '/users/invitations', {
        body: { email: 'unsent@demo.test', name: 'Never Sent', role: 'inspector' },
        token: adminToken,
      });
    const res = await invite();
    expect(res.status).toBe(503);
    expect(res.body.code).toBe('SERVICE_UNAVAILABLE');
    expect(res.body.message).toMatch(/invite again/);
    const [pending] = await t.drizzle.select().from(users).where(eq(users.email, 'unsent@demo.test'));
    expect(pending?.passwordHash).toBeNull();
    expect((await invite()).body.code).toBe('SERVICE_UNAVAILABLE');
    const links = await t.drizzle.select().from(emailTokens).where(eq(emailTokens.userId, pending!.id));
    expect(links.filter((l) => l.usedAt === null)).toHaveLength(1);
  });
});
