import { Inject, Injectable, Logger } from '@nestjs/common';
import type { PasswordResetConfirm } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { runInOrganisation } from '../db/organisation-context.js';
import { MailService } from '../mail/mail.service.js';
import { RateLimitService } from '../rate-limit/rate-limit.service.js';
import { UsersRepository } from '../users/users.repository.js';
import { passwordResetMail, publicLink } from './auth.mails.js';
import { EmailTokensRepository } from './email-tokens.repository.js';
import { LINK_REFUSED } from './invitations.service.js';
import { hashOpaqueToken, newOpaqueToken } from './opaque-token.js';
import { PasswordHasher } from './password-hasher.js';
import { SessionStateCache } from './session-state.cache.js';
import { SessionStateRepository } from './session-state.repository.js';

/** Password reset by e-mailed link; the request never reveals whether an account exists. */
@Injectable()
export class PasswordResetService {
  private readonly logger = new Logger(PasswordResetService.name);

  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly users: UsersRepository,
    private readonly emailTokens: EmailTokensRepository,
    private readonly sessionStates: SessionStateRepository,
    private readonly sessionCache: SessionStateCache,
    private readonly passwords: PasswordHasher,
    private readonly limits: RateLimitService,
    private readonly mail: MailService,
  ) {}

  async request(email: string, address: string): Promise<void> {
    const windowS = this.config.PASSWORD_RESET_WINDOW_S;
    await this.limits.consume({ key: `password-reset:address:${address}`, limit: this.config.PASSWORD_RESET_ADDRESS_LIMIT, windowS });
    await this.limits.consume({ key: `password-reset:email:${email}`, limit: this.config.PASSWORD_RESET_EMAIL_LIMIT, windowS });
    // The link belongs to the organisation sign-in opens for this e-mail, and is written inside it.
    const organisationId = await this.users.signInOrganisation(email);
    if (!organisationId) return;
    await runInOrganisation(organisationId, () => this.issueLink(email, organisationId));
  }

  private async issueLink(email: string, organisationId: string): Promise<void> {
    const account = await this.users.findSignInCandidate(email);
    if (!account || !account.active) return;
    const { token, hash } = newOpaqueToken();
    const ttlS = this.config.PASSWORD_RESET_TOKEN_TTL_S;
    // Only the newest link works: an older one lying in a mailbox is spent by asking again.
    await this.db.transaction(async (tx) => {
      await this.emailTokens.spendAllForUser(account.userId, tx, 'password-reset');
      await this.emailTokens.insert(
        { kind: 'password-reset', userId: account.userId, organisationId, tokenHash: hash, expiresAt: new Date(Date.now() + ttlS * 1000) },
        tx,
      );
    });
    const link = publicLink(this.config.PUBLIC_URL, this.config.HOST, this.config.PORT, '/reset-password', token);
    // Not awaited: waiting for SMTP only when the account exists would tell the caller that it does.
    this.mail
      .send(account.email, passwordResetMail({ link, validMinutes: Math.max(1, Math.round(ttlS / 60)) }), organisationId)
      .catch(() => this.logger.warn('a password-reset e-mail could not be sent'));
  }

  /** Sets the new password, spends every outstanding link and ends every session of the user. */
  async confirm(input: PasswordResetConfirm): Promise<void> {
    const tokenHash = hashOpaqueToken(input.token);
    // Before any organisation is known: the link's own names the one to work in.
    const organisationId = await this.emailTokens.organisationOf(tokenHash);
    if (!organisationId) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
    await runInOrganisation(organisationId, () => this.confirmInOrganisation(input, tokenHash));
  }

  private async confirmInOrganisation(input: PasswordResetConfirm, tokenHash: string): Promise<void> {
    if (!(await this.emailTokens.findUsable('password-reset', tokenHash))) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
    const passwordHash = await this.passwords.hash(input.password);
    const userId = await this.db.transaction(async (tx) => {
      const token = await this.emailTokens.findUsable('password-reset', tokenHash, tx, true);
      const account = token ? await this.users.findUser(token.userId, tx) : null;
      if (!token || !account || !account.active) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
      await this.users.updateUser(account.id, { passwordHash }, tx);
      await this.emailTokens.spendAllForUser(account.id, tx);
      // Whoever knew the old password may hold tokens: every access and refresh token of the user ends.
      await this.sessionStates.endAllSessions(account.id, tx);
      const profile = await this.users.findSignInCandidate(account.email, tx);
      if (profile) {
        await this.users.insertAudit(
          { organisationId: profile.organisationId, actorId: account.id, entityType: 'user', entityId: account.id, action: 'password-reset' },
          tx,
        );
      }
      return account.id;
    });
    this.sessionCache.forget(userId);
  }
}
