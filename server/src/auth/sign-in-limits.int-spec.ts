import { like } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rateLimits } from '../db/schema/index.js';
import { useMailFake, type MailFake } from '../../test/mail-fake.js';
import { api, type ApiAnswer } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

const WINDOW_S = 600;
/** The first wait once an account's free attempts are used: far below the window. */
const DELAY_S = 60;

describe('rate limits on sign-in and password reset, counted in PostgreSQL', () => {
  let t: TestApp;
  let mail: MailFake;
  const signInFrom = (address: string, email: string, password = 'wrong-password'): Promise<ApiAnswer> =>
    api(t.baseUrl, 'POST', '/auth/sign-in', { body: { email, password }, headers: { 'x-forwarded-for': address } });
  const resetFrom = (address: string, email: string): Promise<ApiAnswer> =>
    api(t.baseUrl, 'POST', '/auth/password-reset', { body: { email }, headers: { 'x-forwarded-for': address } });

  function expectLimited(res: ApiAnswer): void {
    expect(res.status).toBe(429);
    expect(res.body.code).toBe('RATE_LIMITED');
    const retryAfter = Number(res.headers.get('retry-after'));
    expect(retryAfter).toBeGreaterThanOrEqual(1);
    expect(retryAfter).toBeLessThanOrEqual(WINDOW_S);
  }

  beforeAll(async () => {
    mail = await useMailFake();
    t = await startTestApp({
      env: {
        ...mail.env,
        SIGN_IN_ACCOUNT_LIMIT: '3',
        SIGN_IN_ADDRESS_LIMIT: '5',
        SIGN_IN_WINDOW_S: String(WINDOW_S),
        SIGN_IN_DELAY_BASE_S: String(DELAY_S),
        PASSWORD_RESET_EMAIL_LIMIT: '2',
        PASSWORD_RESET_ADDRESS_LIMIT: '3',
        PASSWORD_RESET_WINDOW_S: String(WINDOW_S),
      },
    });
  });
  afterAll(async () => {
    await t?.close();
    await mail?.close();
  });

  it('makes an account wait after three failures (429, Retry-After), even with the right password from another address', async () => {
    for (const n of [1, 2, 3]) expect((await signInFrom(`10.1.0.${n}`, 'inspector@demo.test')).status).toBe(401);
    expectLimited(await signInFrom('10.1.0.4', 'inspector@demo.test', 'plummet-demo'));
  });

  it('limits an unknown e-mail exactly like a known one', async () => {
    const statuses = [];
    for (const n of [1, 2, 3, 4]) statuses.push((await signInFrom(`10.2.0.${n}`, 'nobody-here@demo.test')).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it('forgets an account’s failures once it signs in successfully', async () => {
    for (const n of [1, 2]) expect((await signInFrom(`10.3.0.${n}`, 'manager@demo.test')).status).toBe(401);
    expect((await signInFrom('10.3.0.3', 'manager@demo.test', 'plummet-demo')).status).toBe(200);
    for (const n of [4, 5, 6]) expect((await signInFrom(`10.3.1.${n}`, 'manager@demo.test')).status).toBe(401);
    expectLimited(await signInFrom('10.3.1.7', 'manager@demo.test', 'plummet-demo'));
  });

  it('refuses a sixth attempt from one address whatever the accounts', async () => {
    for (const n of [1, 2, 3, 4, 5]) expect((await signInFrom('10.4.0.1', `someone-${n}@demo.test`)).status).toBe(401);
    expectLimited(await signInFrom('10.4.0.1', 'admin@demo.test', 'plummet-demo'));
    expect((await signInFrom('10.4.0.2', 'admin@demo.test', 'plummet-demo')).status).toBe(200);
  });

  it('counts concurrent attempts atomically: exactly the limit gets through', async () => {
    // Several rounds of a burst wider than the pool, so attempts really meet on the row.
    for (const round of [1, 2, 3, 4, 5]) {
      const answers = await Promise.all(
        Array.from({ length: 12 }, (_, n) => signInFrom(`10.5.${round}.${n + 1}`, `concurrent-${round}@demo.test`)),
      );
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses, `round ${round}`).toEqual([401, 401, 401, ...Array<number>(9).fill(429)]);
    }
  });

  it('starts a new window once the old one has closed', async () => {
    for (const n of [1, 2, 3]) await signInFrom(`10.6.0.${n}`, 'foreman@demo.test');
    expectLimited(await signInFrom('10.6.0.4', 'foreman@demo.test', 'plummet-demo'));
    await t.drizzle.update(rateLimits).set({ resetAt: new Date(Date.now() - 1000) }).where(like(rateLimits.key, '%foreman@demo.test'));
    expect((await signInFrom('10.6.0.5', 'foreman@demo.test', 'plummet-demo')).status).toBe(200);
  });

  it('limits password-reset requests per e-mail and per address, known or not', async () => {
    expect((await resetFrom('10.7.0.1', 'inspector@other.test')).status).toBe(202);
    expect((await resetFrom('10.7.0.2', 'inspector@other.test')).status).toBe(202);
    expectLimited(await resetFrom('10.7.0.3', 'inspector@other.test'));

    for (const n of [1, 2, 3]) expect((await resetFrom('10.8.0.1', `reset-${n}@nowhere.test`)).status).toBe(202);
    expectLimited(await resetFrom('10.8.0.1', 'reset-4@nowhere.test'));
  });
});
