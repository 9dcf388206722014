import { Inject, Injectable } from '@nestjs/common';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { refreshTokens } from '../db/schema/index.js';

export type RefreshTokenRow = typeof refreshTokens.$inferSelect;

@Injectable()
export class RefreshTokensRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async insert(values: typeof refreshTokens.$inferInsert, ex: DbExecutor = this.db): Promise<void> {
    await ex.insert(refreshTokens).values(values);
  }

  /**
   * The organisation of a refresh token, by its hash, across organisations (the function
   * auth_refresh_token_organisation): a refresh comes before any organisation is known.
   */
  async organisationOf(tokenHash: string, ex: DbExecutor = this.db): Promise<string | null> {
    const result = await ex.execute<{ organisation: string | null }>(sql`SELECT auth_refresh_token_organisation(${tokenHash})::text AS organisation`);
    return result.rows[0]?.organisation ?? null;
  }

  /** Locks the row until the transaction ends, so a second refresh with the same token waits and then sees it used. */
  async findByHashForUpdate(tokenHash: string, ex: DbExecutor): Promise<RefreshTokenRow | null> {
    const [row] = await ex.select().from(refreshTokens).where(eq(refreshTokens.tokenHash, tokenHash)).for('update');
    return row ?? null;
  }

  async markUsed(id: string, ex: DbExecutor = this.db): Promise<void> {
    await ex.update(refreshTokens).set({ usedAt: new Date() }).where(eq(refreshTokens.id, id));
  }

  async revokeFamily(familyId: string, ex: DbExecutor = this.db): Promise<void> {
    await ex
      .update(refreshTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(refreshTokens.familyId, familyId), isNull(refreshTokens.revokedAt)));
  }

  /** Revokes the family the token belongs to; nothing happens for an unknown token. */
  async revokeFamilyOfToken(tokenHash: string, ex: DbExecutor = this.db): Promise<void> {
    const family = ex.select({ familyId: refreshTokens.familyId }).from(refreshTokens).where(eq(refreshTokens.tokenHash, tokenHash));
    await ex
      .update(refreshTokens)
      .set({ revokedAt: new Date() })
      .where(and(inArray(refreshTokens.familyId, family), isNull(refreshTokens.revokedAt)));
  }

  async revokeAllForUser(userId: string, ex: DbExecutor = this.db): Promise<void> {
    await ex
      .update(refreshTokens)
      .set({ revokedAt: new Date() })
      .where(and(eq(refreshTokens.userId, userId), isNull(refreshTokens.revokedAt)));
  }
}
