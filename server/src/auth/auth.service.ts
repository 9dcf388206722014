import { Inject, Injectable } from '@nestjs/common';
import type { Session, SignIn } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { runInOrganisation } from '../db/organisation-context.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { addressLimitKey } from '../rate-limit/client-address.js';
import { RateLimitService } from '../rate-limit/rate-limit.service.js';
import { UsersRepository } from '../users/users.repository.js';
import { PasswordHasher } from './password-hasher.js';
import { SessionsService } from './sessions.service.js';

/** The one answer for every failed sign-in, so it tells nothing about which accounts exist. */
export const SIGN_IN_REFUSED = 'The e-mail or password is not right';

@Injectable()
export class AuthService {
  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly users: UsersRepository,
    private readonly passwords: PasswordHasher,
    private readonly sessions: SessionsService,
    private readonly limits: RateLimitService,
  ) {}

  /**
   * Checks the password (always, even for unknown or inactive accounts, so timing is alike) under
   * two limits. Per client address (IPv6 by its /64): a fixed window of attempts, taken before the
   * check so concurrent guesses cannot all slip through, and given back when the password was
   * right, so a successful sign-in never counts. Per account: no lockout, a growing delay between
   * attempts once several have failed; a success forgets the failures.
   */
  async signIn(input: SignIn, address: string): Promise<Session> {
    const windowS = this.config.SIGN_IN_WINDOW_S;
    const addressKey = `sign-in:address:${addressLimitKey(address)}`;
    await this.limits.consume({ key: addressKey, limit: this.config.SIGN_IN_ADDRESS_LIMIT, windowS });
    const accountKey = `sign-in:account:${input.email}`;
    try {
      await this.limits.attemptWithDelay(accountKey, {
        freeAttempts: this.config.SIGN_IN_ACCOUNT_LIMIT,
        quietS: windowS,
        baseDelayS: this.config.SIGN_IN_DELAY_BASE_S,
        maxDelayS: this.config.SIGN_IN_DELAY_MAX_S,
      });
    } catch (error) {
      // Refused before any password was looked at: not an attempt against the address either.
      await this.limits.refund(addressKey);
      throw error;
    }

    // No organisation is known yet: a narrow look-up names the one this e-mail signs in to, and
    // everything after it runs inside that organisation.
    const organisationId = await this.users.signInOrganisation(input.email);
    const candidate = organisationId
      ? await runInOrganisation(organisationId, async () => await this.users.findSignInCandidate(input.email))
      : null;
    const matches = await this.passwords.verify(candidate?.passwordHash ?? null, input.password);
    if (!candidate || !matches || !candidate.active) throw new AppError(ErrorCode.Unauthenticated, SIGN_IN_REFUSED);

    await this.limits.refund(addressKey);
    await this.limits.reset(accountKey);
    const { passwordHash: _hash, ...profile } = candidate;
    return runInOrganisation(profile.organisationId, () => this.sessions.start(profile));
  }
}
