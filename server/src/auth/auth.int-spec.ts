import { createHash } from 'node:crypto';
import { JwtService } from '@nestjs/jwt';
import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { refreshTokens, users } from '../db/schema/index.js';
import { accountTablesDigest, api } from '../../test/request.js';
import { signIn } from '../../test/sign-in.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';
import { REFRESH_RETRY_GRACE_MS } from './sessions.service.js';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');

describe('sign-in, refresh and sign-out against the real PostgreSQL', () => {
  let t: TestApp;
  const post = (path: string, body: unknown, headers?: Record<string, string>) => api(t.baseUrl, 'POST', path, { body, headers });

  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  it('signs in with the right password and answers tokens and the profile', async () => {
    const res = await post('/auth/sign-in', { email: 'admin@demo.test', password: 'plummet-demo' });
    expect(res.status).toBe(200);
    expect(res.body.refreshToken).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(res.body.user).toEqual({
      id: expect.any(String),
      email: 'admin@demo.test',
      name: 'Priya Okafor',
      position: 'Safety systems administrator',
      units: 'si',
      windUnits: 'mps',
      role: 'admin',
      organisation: { id: expect.any(String), name: 'Harrow & Span Access Ltd' },
      version: expect.any(Number),
    });
    const me = await api(t.baseUrl, 'GET', '/users/me', { token: res.body.accessToken });
    expect(me.status).toBe(200);
    expect(me.body.email).toBe('admin@demo.test');
  });

  it('accepts the e-mail in any case and with spaces around it', async () => {
    const res = await post('/auth/sign-in', { email: '  Manager@Demo.TEST ', password: 'plummet-demo' });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe('manager');
  });

  it('answers a wrong password, an unknown e-mail and an inactive account identically', async () => {
    const wrong = await post('/auth/sign-in', { email: 'inspector@demo.test', password: 'not-the-password' }, { 'x-forwarded-for': '10.9.0.1' });
    const unknown = await post('/auth/sign-in', { email: 'nobody@demo.test', password: 'not-the-password' }, { 'x-forwarded-for': '10.9.0.2' });
    await t.drizzle.update(users).set({ active: false }).where(eq(users.email, 'foreman@demo.test'));
    try {
      const inactive = await post('/auth/sign-in', { email: 'foreman@demo.test', password: 'plummet-demo' }, { 'x-forwarded-for': '10.9.0.3' });
      for (const res of [wrong, unknown, inactive]) {
        expect(res.status).toBe(401);
        expect(res.body).toEqual({ code: 'UNAUTHENTICATED', message: 'The e-mail or password is not right' });
      }
    } finally {
      await t.drizzle.update(users).set({ active: true }).where(eq(users.email, 'foreman@demo.test'));
    }
  });

  it('stores refresh tokens only as SHA-256 hashes, each with a family', async () => {
    const session = await signIn(t.baseUrl, 'inspector@demo.test');
    const rows = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, sha256(session.refreshToken)));
    expect(rows).toHaveLength(1);
    expect(rows[0].familyId).toMatch(/^[0-9a-f-]{36}$/);
    const leaked = await t.drizzle.execute(sql`SELECT 1 FROM refresh_tokens t WHERE t::text LIKE ${'%' + session.refreshToken + '%'}`);
    expect(leaked.rows).toHaveLength(0);
  });

  it('rotates the refresh token on use: a new token in the same family, the old one marked used', async () => {
    const first = await signIn(t.baseUrl, 'inspector@demo.test');
    const res = await post('/auth/refresh', { refreshToken: first.refreshToken });
    expect(res.status).toBe(200);
    expect(res.body.refreshToken).not.toBe(first.refreshToken);
    expect(res.body.user.email).toBe('inspector@demo.test');
    const [old] = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, sha256(first.refreshToken)));
    const [next] = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, sha256(res.body.refreshToken)));
    expect(old.usedAt).not.toBeNull();
    expect(next.usedAt).toBeNull();
    expect(next.familyId).toBe(old.familyId);
    expect((await api(t.baseUrl, 'GET', '/users/me', { token: res.body.accessToken })).status).toBe(200);
  });

  it('revokes the whole family when an already-used refresh token comes back after the retry window', async () => {
    const first = await signIn(t.baseUrl, 'foreman@demo.test');
    const second = await post('/auth/refresh', { refreshToken: first.refreshToken });
    expect(second.status).toBe(200);
    // Its first use was longer ago than the retry window.
    await t.drizzle
      .update(refreshTokens)
      .set({ usedAt: new Date(Date.now() - REFRESH_RETRY_GRACE_MS - 1000) })
      .where(eq(refreshTokens.tokenHash, sha256(first.refreshToken)));
    const reuse = await post('/auth/refresh', { refreshToken: first.refreshToken });
    expect(reuse.status).toBe(401);
    expect(reuse.body.code).toBe('UNAUTHENTICATED');
    const afterReuse = await post('/auth/refresh', { refreshToken: second.body.refreshToken });
    expect(afterReuse.status).toBe(401);
    const family = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, sha256(second.body.refreshToken)));
    expect(family[0].revokedAt).not.toBeNull();
  });

  it('answers a refresh retried within the window (its first answer lost) with a working token, and does not end the session', async () => {
    const session = await signIn(t.baseUrl, 'inspector@demo.test');
    const lost = await post('/auth/refresh', { refreshToken: session.refreshToken });
    expect(lost.status).toBe(200);
    const retry = await post('/auth/refresh', { refreshToken: session.refreshToken });
    expect(retry.status).toBe(200);
    expect(retry.body.refreshToken).not.toBe(lost.body.refreshToken);
    expect((await post('/auth/refresh', { refreshToken: retry.body.refreshToken })).status).toBe(200);
    const [first] = await t.drizzle.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, sha256(session.refreshToken)));
    expect(first.revokedAt).toBeNull();
  });

  it('serialises two concurrent refreshes with the same token: both within the window, both answered', async () => {
    for (let round = 0; round < 3; round++) {
      const session = await signIn(t.baseUrl, 'manager@demo.test');
      const answers = await Promise.all([0, 1].map(() => post('/auth/refresh', { refreshToken: session.refreshToken })));
      expect(answers.map((a) => a.status)).toEqual([200, 200]);
      for (const a of answers) expect((await post('/auth/refresh', { refreshToken: a.body.refreshToken })).status).toBe(200);
    }
  });

  it('signs out by revoking the family, and answers 204 for a token it does not know', async () => {
    const session = await signIn(t.baseUrl, 'admin@demo.test');
    const rotated = await post('/auth/refresh', { refreshToken: session.refreshToken });
    const out = await post('/auth/sign-out', { refreshToken: rotated.body.refreshToken });
    expect(out.status).toBe(204);
    expect((await post('/auth/refresh', { refreshToken: rotated.body.refreshToken })).status).toBe(401);
    expect((await post('/auth/sign-out', { refreshToken: 'A'.repeat(43) })).status).toBe(204);
  });

  it('refuses an expired refresh token with 401 UNAUTHENTICATED', async () => {
    const session = await signIn(t.baseUrl, 'inspector@demo.test');
    await t.drizzle
      .update(refreshTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(refreshTokens.tokenHash, sha256(session.refreshToken)));
    const res = await post('/auth/refresh', { refreshToken: session.refreshToken });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('UNAUTHENTICATED');
  });

  it('ends the session at the next refresh once the user is deactivated', async () => {
    const session = await signIn(t.baseUrl, 'foreman@demo.test');
    await t.drizzle.update(users).set({ active: false }).where(eq(users.email, 'foreman@demo.test'));
    try {
      expect((await post('/auth/refresh', { refreshToken: session.refreshToken })).status).toBe(401);
    } finally {
      await t.drizzle.update(users).set({ active: true }).where(eq(users.email, 'foreman@demo.test'));
    }
  });

  it('refuses an expired access token with 401 UNAUTHENTICATED', async () => {
    const session = await signIn(t.baseUrl, 'inspector@demo.test');
    const jwt = t.app.get(JwtService);
    const claims = jwt.decode<{ sub: string; org: string; role: string }>(session.accessToken);
    const expired = await jwt.signAsync({ sub: claims.sub, org: claims.org, role: claims.role }, { expiresIn: -10 });
    const res = await api(t.baseUrl, 'GET', '/users/me', { token: expired });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('UNAUTHENTICATED');
  });

  it('refuses a refresh token that was never issued', async () => {
    const res = await post('/auth/refresh', { refreshToken: 'B'.repeat(43) });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('UNAUTHENTICATED');
  });

  describe('bad input on every auth route answers 400 with a code and changes nothing', () => {
    const long = 'x'.repeat(300);
    const routes: Record<string, unknown[]> = {
      '/auth/sign-in': [{}, { email: 5, password: true }, { email: 'admin@demo.test' }, { email: `${long}@demo.test`, password: 'plummet-demo' }, { email: 'admin@demo.test', password: 'p'.repeat(201) }, { email: 'admin@demo.test', password: 'plummet-demo', extra: 1 }, [], 'null'],
      '/auth/refresh': [{}, { refreshToken: 42 }, { refreshToken: 'short' }, { refreshToken: long }],
      '/auth/sign-out': [{}, { refreshToken: null }, { refreshToken: long }],
      '/auth/accept-invite': [{}, { token: 'A'.repeat(43) }, { token: 'A'.repeat(43), password: 'short' }, { token: 'A'.repeat(43), password: 'p'.repeat(201) }, { token: 1, password: 'long-enough-pw' }],
      '/auth/password-reset': [{}, { email: 'not-an-address' }, { email: `${long}@demo.test` }, { email: ['admin@demo.test'] }],
      '/auth/password-reset/confirm': [{}, { token: 'A'.repeat(43) }, { token: 'A'.repeat(43), password: 'p'.repeat(201) }, { token: long, password: 'long-enough-pw' }],
    };

    for (const [path, bodies] of Object.entries(routes)) {
      it(`refuses malformed JSON, wrong types, missing fields and over-long strings on ${path}`, async () => {
        const before = await accountTablesDigest(t.drizzle);
        const malformed = await post(path, '{"email": ');
        expect(malformed.status).toBe(400);
        expect(malformed.body.code).toBe('INVALID_JSON');
        for (const body of bodies) {
          const res = await post(path, typeof body === 'string' ? body : JSON.stringify(body));
          expect(res.status, JSON.stringify(body)).toBe(400);
          // A bare JSON `null` is refused by the strict body parser already.
          expect(res.body.code).toBe(body === 'null' ? 'INVALID_JSON' : 'VALIDATION_FAILED');
        }
        expect(await accountTablesDigest(t.drizzle)).toEqual(before);
      });
    }
  });
});
