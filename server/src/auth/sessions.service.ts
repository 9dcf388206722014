import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import type { Session } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { runInOrganisation } from '../db/organisation-context.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { toUserProfile } from '../users/users.mapper.js';
import { type ProfileRow, UsersRepository } from '../users/users.repository.js';
import type { AccessTokenClaims } from './auth.types.js';
import { hashOpaqueToken, newOpaqueToken } from './opaque-token.js';
import { RefreshTokensRepository } from './refresh-tokens.repository.js';

/**
 * A refresh token presented again this soon after its first use is a retry whose answer was lost
 * (the phone went into a lift), not a theft: it gets a new token of the same family. Later, reuse
 * revokes the family. 30 s is common practice, no source: long enough for a mobile retry.
 */
export const REFRESH_RETRY_GRACE_MS = 30_000;

type RefreshOutcome = { ok: true; profile: ProfileRow; refreshToken: string } | { ok: false; message: string };

/**
 * Sessions: a short-lived access JWT plus a single-use refresh token. Each refresh replaces the
 * token with a new one of the same family; presenting a replaced token again means it leaked,
 * so the whole family is revoked (after a short grace window for a retry, REFRESH_RETRY_GRACE_MS).
 */
@Injectable()
export class SessionsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly jwt: JwtService,
    private readonly users: UsersRepository,
    private readonly refreshTokens: RefreshTokensRepository,
  ) {}

  /** Opens a new session (new token family) for a member of an organisation. */
  async start(profile: ProfileRow, ex: DbExecutor = this.db): Promise<Session> {
    const refreshToken = await this.addRefreshToken(profile.userId, profile.organisationId, randomUUID(), ex);
    return this.session(profile, refreshToken);
  }

  async refresh(refreshToken: string): Promise<Session> {
    const tokenHash = hashOpaqueToken(refreshToken);
    // Before any organisation is known: the token's own names the one to work in.
    const organisationId = await this.refreshTokens.organisationOf(tokenHash);
    if (!organisationId) throw new AppError(ErrorCode.Unauthenticated, 'The session has ended; sign in again');
    return runInOrganisation(organisationId, () => this.refreshInOrganisation(tokenHash));
  }

  private async refreshInOrganisation(tokenHash: string): Promise<Session> {
    // The row lock makes concurrent refreshes with one token queue up: the first rotates it, the next sees it used.
    const outcome = await this.db.transaction(async (tx): Promise<RefreshOutcome> => {
      const row = await this.refreshTokens.findByHashForUpdate(tokenHash, tx);
      if (!row || row.revokedAt) return { ok: false, message: 'The session has ended; sign in again' };
      const retried = row.usedAt !== null && Date.now() - row.usedAt.getTime() <= REFRESH_RETRY_GRACE_MS;
      if (row.usedAt && !retried) {
        // Committed before answering 401, so the revocation sticks.
        await this.refreshTokens.revokeFamily(row.familyId, tx);
        return { ok: false, message: 'This session was already renewed elsewhere and has been ended; sign in again' };
      }
      if (row.expiresAt.getTime() <= Date.now()) return { ok: false, message: 'The session has expired; sign in again' };
      const profile = await this.users.findProfile(row.userId, row.organisationId, tx);
      if (!profile || !profile.active) {
        await this.refreshTokens.revokeFamily(row.familyId, tx);
        return { ok: false, message: 'The session has ended; sign in again' };
      }
      // A retry keeps the first use's time, so the window never stretches.
      if (!retried) await this.refreshTokens.markUsed(row.id, tx);
      // The new token inherits the family's expiry: refreshing never lengthens a session past REFRESH_TOKEN_TTL_S.
      const next = await this.addRefreshToken(row.userId, row.organisationId, row.familyId, tx, row.expiresAt);
      return { ok: true, profile, refreshToken: next };
    });
    if (!outcome.ok) throw new AppError(ErrorCode.Unauthenticated, outcome.message);
    return this.session(outcome.profile, outcome.refreshToken);
  }

  /** Ends the session the token belongs to (its whole family). Unknown tokens are ignored. */
  async signOut(refreshToken: string): Promise<void> {
    const tokenHash = hashOpaqueToken(refreshToken);
    const organisationId = await this.refreshTokens.organisationOf(tokenHash);
    if (!organisationId) return;
    await runInOrganisation(organisationId, () => this.refreshTokens.revokeFamilyOfToken(tokenHash));
  }

  private async addRefreshToken(
    userId: string,
    organisationId: string,
    familyId: string,
    ex: DbExecutor,
    expiresAt = new Date(Date.now() + this.config.REFRESH_TOKEN_TTL_S * 1000),
  ): Promise<string> {
    const { token, hash } = newOpaqueToken();
    await this.refreshTokens.insert({ userId, organisationId, familyId, tokenHash: hash, expiresAt }, ex);
    return token;
  }

  private async session(profile: ProfileRow, refreshToken: string): Promise<Session> {
    const claims: AccessTokenClaims = { sub: profile.userId, org: profile.organisationId, role: profile.role, ver: profile.sessionVersion };
    const accessToken = await this.jwt.signAsync(claims);
    return { accessToken, refreshToken, user: toUserProfile(profile) };
  }
}
