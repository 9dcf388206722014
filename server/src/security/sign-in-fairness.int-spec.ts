import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { rateLimits } from '../db/schema/index.js';
import { api, type ApiAnswer } from '../../test/request.js';
import { startTestApp, type TestApp } from '../../test/test-app.js';

/** Sign-in limits that stop guessing without letting anyone lock real users out. */
describe('sign-in limits cannot be turned against the people they protect', () => {
  let t: TestApp;
  let untrusting: TestApp;
  const signIn = (app: TestApp, address: string, email: string, password: string): Promise<ApiAnswer> =>
    api(app.baseUrl, 'POST', '/auth/sign-in', { body: { email, password }, headers: { 'x-forwarded-for': address } });

  beforeAll(async () => {
    const env = { SIGN_IN_ACCOUNT_LIMIT: '3', SIGN_IN_ADDRESS_LIMIT: '4', SIGN_IN_WINDOW_S: '900', SIGN_IN_DELAY_BASE_S: '30' };
    t = await startTestApp({ env });
    untrusting = await startTestApp({ env: { ...env, TRUST_PROXY: 'false' } });
  });
  afterAll(async () => {
    await t?.close();
    await untrusting?.close();
  });

  it('never counts a successful sign-in: a whole office behind one address keeps signing in', async () => {
    for (let n = 0; n < 10; n++) expect((await signIn(t, '198.51.100.10', 'manager@demo.test', 'plummet-demo')).status).toBe(200);
    expect((await signIn(t, '198.51.100.10', 'admin@demo.test', 'plummet-demo')).status).toBe(200);
  });

  it('lets the real user in once a short delay has passed, however many wrong guesses came first', async () => {
    for (let n = 0; n < 3; n++) await signIn(t, `198.51.100.${20 + n}`, 'inspector@demo.test', 'wrong-guess');
    const refused = await signIn(t, '198.51.100.30', 'inspector@demo.test', 'plummet-demo');
    expect(refused.status).toBe(429);
    expect(Number(refused.headers.get('retry-after'))).toBeLessThanOrEqual(30);
    // The delay is over (moved into the past rather than waited for).
    await t.drizzle.update(rateLimits).set({ blockedUntil: new Date(Date.now() - 1000) }).where(eq(rateLimits.key, 'sign-in:account:inspector@demo.test'));
    expect((await signIn(t, '198.51.100.31', 'inspector@demo.test', 'plummet-demo')).status).toBe(200);
  });

  it('doubles the delay with each further failure instead of locking the account', async () => {
    const key = 'sign-in:account:nobody-here@demo.test';
    const waits: number[] = [];
    for (let n = 0; n < 6; n++) {
      await t.drizzle.update(rateLimits).set({ blockedUntil: null }).where(eq(rateLimits.key, key));
      await signIn(t, `198.51.100.${40 + n}`, 'nobody-here@demo.test', 'wrong-guess');
      const [row] = await t.drizzle.select().from(rateLimits).where(eq(rateLimits.key, key));
      waits.push(row.blockedUntil ? Math.round((row.blockedUntil.getTime() - Date.now()) / 1000) : 0);
    }
    expect(waits.slice(0, 2)).toEqual([0, 0]);
    expect(waits[3] / waits[2]).toBeCloseTo(2, 0);
    expect(waits[5] / waits[4]).toBeCloseTo(2, 0);
  });

  it('keys IPv6 clients by their /64, so hopping addresses inside it gains nothing', async () => {
    for (let n = 1; n <= 4; n++) await signIn(t, `2001:db8:77:1::${n}`, `ipv6-${n}@demo.test`, 'wrong-guess');
    expect((await signIn(t, '2001:db8:77:1:ffff::99', 'admin@demo.test', 'plummet-demo')).status).toBe(429);
    expect((await signIn(t, '2001:db8:77:2::1', 'admin@demo.test', 'plummet-demo')).status).toBe(200);
  });

  it('ignores X-Forwarded-For unless TRUST_PROXY trusts the sender', async () => {
    for (let n = 1; n <= 4; n++) await signIn(untrusting, `192.0.2.${n}`, `spoof-${n}@demo.test`, 'wrong-guess');
    // Every attempt came from 127.0.0.1 whatever the header said: the address limit is reached.
    expect((await signIn(untrusting, '192.0.2.99', 'admin@demo.test', 'plummet-demo')).status).toBe(429);
  });
});
