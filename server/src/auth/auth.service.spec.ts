import { describe, expect, it, vi } from 'vitest';
import { AppError } from '../common/app-error.js';
import type { AppConfig } from '../config/config.js';
import type { RateLimitService } from '../rate-limit/rate-limit.service.js';
import { RateLimitedError } from '../rate-limit/rate-limited.error.js';
import type { SignInCandidate, UsersRepository } from '../users/users.repository.js';
import { AuthService, SIGN_IN_REFUSED } from './auth.service.js';
import type { PasswordHasher } from './password-hasher.js';
import type { SessionsService } from './sessions.service.js';

const config = { SIGN_IN_ACCOUNT_LIMIT: 5, SIGN_IN_ADDRESS_LIMIT: 30, SIGN_IN_WINDOW_S: 900, SIGN_IN_DELAY_BASE_S: 2, SIGN_IN_DELAY_MAX_S: 300 } as AppConfig;

const account: SignInCandidate = {
  userId: '11111111-1111-4111-8111-111111111111',
  email: 'inspector@demo.test',
  name: 'Aileen Marsh',
  position: 'Inspector',
  units: 'si',
  windUnits: 'mps',
  active: true,
  sessionVersion: 0,
  version: 1,
  role: 'inspector',
  organisationId: '22222222-2222-4222-8222-222222222222',
  organisationName: 'Harrow & Span Access Ltd',
  passwordHash: '$argon2id$real',
};

function setUp(found: SignInCandidate | null, passwordMatches: boolean) {
  const users = {
    // The organisation sign-in opens for the e-mail (a look-up across organisations), then the account in it.
    signInOrganisation: vi.fn(async () => found?.organisationId ?? null),
    findSignInCandidate: vi.fn(async () => found),
  };
  const passwords = { verify: vi.fn(async () => passwordMatches) };
  const sessions = { start: vi.fn(async () => ({ accessToken: 'a', refreshToken: 'r', user: {} })) };
  const limits = {
    consume: vi.fn(async () => undefined),
    attemptWithDelay: vi.fn(async () => undefined),
    refund: vi.fn(async () => undefined),
    reset: vi.fn(async () => undefined),
  };
  const service = new AuthService(
    config,
    users as unknown as UsersRepository,
    passwords as unknown as PasswordHasher,
    sessions as unknown as SessionsService,
    limits as unknown as RateLimitService,
  );
  return { service, users, passwords, sessions, limits };
}

async function refusal(promise: Promise<unknown>): Promise<{ code: string; message: string }> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(AppError);
  return { code: (error as AppError).code, message: (error as AppError).message };
}

describe('AuthService.signIn with the repositories replaced', () => {
  const input = { email: 'inspector@demo.test', password: 'guess' };

  it('still runs a password verification against a dummy hash when the e-mail is unknown', async () => {
    const { service, passwords } = setUp(null, false);
    await refusal(service.signIn(input, '203.0.113.7'));
    expect(passwords.verify).toHaveBeenCalledWith(null, 'guess');
  });

  it('gives one refusal for an unknown e-mail, a wrong password and an inactive account', async () => {
    const unknown = await refusal(setUp(null, false).service.signIn(input, 'a'));
    const wrong = await refusal(setUp(account, false).service.signIn(input, 'a'));
    const inactiveSetUp = setUp({ ...account, active: false }, true);
    const inactive = await refusal(inactiveSetUp.service.signIn(input, 'a'));
    expect(unknown).toEqual({ code: 'UNAUTHENTICATED', message: SIGN_IN_REFUSED });
    expect(wrong).toEqual(unknown);
    expect(inactive).toEqual(unknown);
    expect(inactiveSetUp.passwords.verify).toHaveBeenCalledWith('$argon2id$real', 'guess');
    expect(inactiveSetUp.sessions.start).not.toHaveBeenCalled();
  });

  it('keeps a wrong password counted against the address (its /64 for IPv6) and the account', async () => {
    const { service, limits } = setUp(account, false);
    await refusal(service.signIn(input, '2001:db8:1:2:aaaa::7'));
    expect(limits.consume.mock.calls.map((c) => (c as unknown as [{ key: string }])[0].key)).toEqual(['sign-in:address:2001:db8:1:2::/64']);
    expect(limits.attemptWithDelay.mock.calls.map((c) => (c as unknown as [string])[0])).toEqual(['sign-in:account:inspector@demo.test']);
    expect(limits.refund).not.toHaveBeenCalled();
    expect(limits.reset).not.toHaveBeenCalled();
  });

  it('gives the attempt back to the address when the password was right', async () => {
    const { service, limits } = setUp(account, true);
    await service.signIn(input, '203.0.113.7');
    expect(limits.refund).toHaveBeenCalledWith('sign-in:address:203.0.113.7');
  });

  it('checks no password at all once a limit is reached', async () => {
    const { service, limits, passwords } = setUp(account, true);
    limits.consume.mockRejectedValueOnce(new RateLimitedError(120));
    const error = await service.signIn(input, 'a').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(RateLimitedError);
    expect((error as RateLimitedError).retryAfterS).toBe(120);
    expect(passwords.verify).not.toHaveBeenCalled();
  });

  it('on success clears the account’s failures and opens a session without the password hash', async () => {
    const { service, limits, sessions } = setUp(account, true);
    await service.signIn(input, 'a');
    expect(limits.reset).toHaveBeenCalledWith('sign-in:account:inspector@demo.test');
    const profile = (sessions.start.mock.calls[0] as unknown as [Record<string, unknown>])[0];
    expect(profile).not.toHaveProperty('passwordHash');
    expect(profile).toMatchObject({ userId: account.userId, role: 'inspector' });
  });
});
