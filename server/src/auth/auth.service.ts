import { Inject, Injectable } from '@nestjs/common';
import type { Session, SignIn } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
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
   * two limits: attempts per client address, and attempts per account since its last success.
   */
  async signIn(input: SignIn, address: string): Promise<Session> {
    const windowS = this.config.SIGN_IN_WINDOW_S;
    await this.limits.consume({ key: `sign-in:address:${address}`, limit: this.config.SIGN_IN_ADDRESS_LIMIT, windowS });
    const accountKey = `sign-in:account:${input.email}`;
    await this.limits.consume({ key: accountKey, limit: this.config.SIGN_IN_ACCOUNT_LIMIT, windowS });

    const candidate = await this.users.findSignInCandidate(input.email);
    const matches = await this.passwords.verify(candidate?.passwordHash ?? null, input.password);
    if (!candidate || !matches || !candidate.active) throw new AppError(ErrorCode.Unauthenticated, SIGN_IN_REFUSED);

    await this.limits.reset(accountKey);
    const { passwordHash: _hash, ...profile } = candidate;
    return this.sessions.start(profile);
  }
}
