import { Inject, Injectable } from '@nestjs/common';
import { and, eq, isNull, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { runInOrganisation } from '../db/organisation-context.js';
import { memberships, refreshTokens, users } from '../db/schema/index.js';

export interface SessionState {
  active: boolean;
  sessionVersion: number;
}

/** What the guard needs to know about a token's user, and the one way to end all of a user's sessions. */
@Injectable()
export class SessionStateRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** Null when the user is not (or no longer) a member of the organisation. */
  async find(userId: string, organisationId: string, ex: DbExecutor = this.db): Promise<SessionState | null> {
    // The guard asks before the request's scope exists: the token's (signed) organisation is the one.
    // (Awaited inside the scope: a Drizzle query runs when awaited, not when built.)
    const [row] = await runInOrganisation(organisationId, async () => {
      return await ex
        .select({ active: users.active, sessionVersion: users.sessionVersion })
        .from(users)
        .innerJoin(memberships, and(eq(memberships.userId, users.id), eq(memberships.organisationId, organisationId)))
        .where(eq(users.id, userId));
    });
    return row ?? null;
  }

  /** Makes every access token of the user stale; a refresh then issues one with the current role. */
  async bumpVersion(userId: string, ex: DbExecutor = this.db): Promise<void> {
    await ex.update(users).set({ sessionVersion: sql`${users.sessionVersion} + 1` }).where(eq(users.id, userId));
  }

  /** Raises the session version (every access token becomes stale) and revokes every refresh token. */
  async endAllSessions(userId: string, ex: DbExecutor = this.db): Promise<void> {
    await this.bumpVersion(userId, ex);
    await ex
      .update(refreshTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(refreshTokens.userId, userId), isNull(refreshTokens.revokedAt)));
  }
}
