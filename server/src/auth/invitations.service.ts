import { Inject, Injectable } from '@nestjs/common';
import type { InvitationAccept, InvitationCreate, Member, Session } from '@plummet/shared';
import type { AuthUser } from './auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { runInOrganisation } from '../db/organisation-context.js';
import { MailService } from '../mail/mail.service.js';
import { toMember } from '../users/users.mapper.js';
import { UsersRepository } from '../users/users.repository.js';
import { invitationMail, publicLink } from './auth.mails.js';
import { EmailTokensRepository } from './email-tokens.repository.js';
import { hashOpaqueToken, newOpaqueToken } from './opaque-token.js';
import { PasswordHasher } from './password-hasher.js';
import { SessionsService } from './sessions.service.js';

export const LINK_REFUSED = 'This link is not valid any more; ask for a new one';

/** Admins invite people by e-mail; the link lets them choose a password and signs them in. */
@Injectable()
export class InvitationsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly users: UsersRepository,
    private readonly emailTokens: EmailTokensRepository,
    private readonly passwords: PasswordHasher,
    private readonly sessions: SessionsService,
    private readonly mail: MailService,
  ) {}

  /**
   * Creates the account (no password yet) and membership, or renews a pending invitation of the
   * same organisation, then sends the e-mail after the commit (a slow mail server must not hold a
   * database transaction). If it cannot go, the invitation stays pending and inviting again
   * renews it with a fresh link.
   */
  async invite(admin: AuthUser, input: InvitationCreate): Promise<Member> {
    const inviter = await this.users.findProfile(admin.userId, admin.organisationId);
    if (!inviter) throw AppError.notFound('User');
    const { member, link } = await this.db.transaction(async (tx) => {
      const existing = await this.users.findUserByEmail(input.email, tx);
      let userId: string;
      if (existing) {
        const member = await this.users.findMember(admin.organisationId, existing.id, tx, true);
        if (!member || existing.passwordHash) throw new AppError(ErrorCode.Conflict, 'Someone with this e-mail already has an account');
        userId = existing.id;
        await this.users.updateUser(userId, { name: input.name }, tx);
        await this.users.updateRole(userId, admin.organisationId, input.role, tx);
        await this.emailTokens.spendAllForUser(userId, tx, 'invite');
      } else {
        const inserted = await this.users.insertUser({ email: input.email, name: input.name }, tx);
        if (!inserted) throw new AppError(ErrorCode.Conflict, 'Someone with this e-mail already has an account');
        userId = inserted;
        await this.users.insertMembership({ userId, organisationId: admin.organisationId, role: input.role }, tx);
      }
      const { token, hash } = newOpaqueToken();
      const ttlS = this.config.INVITE_TOKEN_TTL_S;
      await this.emailTokens.insert(
        { kind: 'invite', userId, organisationId: admin.organisationId, role: input.role, tokenHash: hash, expiresAt: new Date(Date.now() + ttlS * 1000) },
        tx,
      );
      const member = (await this.users.findMember(admin.organisationId, userId, tx))!;
      await this.users.insertAudit(
        {
          organisationId: admin.organisationId,
          actorId: admin.userId,
          entityType: 'user',
          entityId: userId,
          action: existing ? 'invitation-renewed' : 'invited',
          after: { email: member.email, name: member.name, role: member.role },
        },
        tx,
      );
      return { member, link: publicLink(this.config.PUBLIC_URL, this.config.HOST, this.config.PORT, '/accept-invite', token) };
    });
    const validDays = Math.max(1, Math.round(this.config.INVITE_TOKEN_TTL_S / 86_400));
    try {
      await this.mail.send(input.email, invitationMail({ organisationName: inviter.organisationName, inviterName: inviter.name, link, validDays }), admin.organisationId);
    } catch {
      throw new AppError(ErrorCode.ServiceUnavailable, 'The invitation is saved but its e-mail could not be sent; invite again to send a new link');
    }
    return toMember(member);
  }

  /** Spends the invitation, sets the password and opens a session in the inviting organisation. */
  async accept(input: InvitationAccept): Promise<Session> {
    const tokenHash = hashOpaqueToken(input.token);
    // Before any organisation is known: the link's own names the one to work in.
    const organisationId = await this.emailTokens.organisationOf(tokenHash);
    if (!organisationId) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
    return runInOrganisation(organisationId, () => this.acceptInOrganisation(input, tokenHash));
  }

  private async acceptInOrganisation(input: InvitationAccept, tokenHash: string): Promise<Session> {
    // Cheap check first: no argon2 work for links that cannot succeed.
    if (!(await this.emailTokens.findUsable('invite', tokenHash))) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
    const passwordHash = await this.passwords.hash(input.password);
    return this.db.transaction(async (tx) => {
      const token = await this.emailTokens.findUsable('invite', tokenHash, tx, true);
      const profile = token?.organisationId ? await this.users.findProfile(token.userId, token.organisationId, tx) : null;
      if (!token || !profile || !profile.active) throw new AppError(ErrorCode.Unauthenticated, LINK_REFUSED);
      await this.users.updateUser(token.userId, { passwordHash }, tx);
      await this.emailTokens.spendAllForUser(token.userId, tx);
      await this.users.insertAudit(
        { organisationId: profile.organisationId, actorId: profile.userId, entityType: 'user', entityId: profile.userId, action: 'invitation-accepted' },
        tx,
      );
      return this.sessions.start(profile, tx);
    });
  }
}
