import { Inject, Injectable } from '@nestjs/common';
import { and, eq, gt, isNull, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { emailTokens } from '../db/schema/index.js';

export type EmailTokenKind = (typeof emailTokens.$inferSelect)['kind'];
export type EmailTokenRow = typeof emailTokens.$inferSelect;

/** One-time links sent by e-mail; only their hashes are stored. */
@Injectable()
export class EmailTokensRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async insert(values: typeof emailTokens.$inferInsert, ex: DbExecutor = this.db): Promise<void> {
    await ex.insert(emailTokens).values(values);
  }

  /**
   * The organisation of an e-mailed link, by its hash, across organisations (the function
   * auth_email_token_organisation): the link is opened before any organisation is known.
   */
  async organisationOf(tokenHash: string, ex: DbExecutor = this.db): Promise<string | null> {
    const result = await ex.execute<{ organisation: string | null }>(sql`SELECT auth_email_token_organisation(${tokenHash})::text AS organisation`);
    return result.rows[0]?.organisation ?? null;
  }

  /** An unused, unexpired token of that kind; `forUpdate` locks it so only one request can use it. */
  async findUsable(kind: EmailTokenKind, tokenHash: string, ex: DbExecutor = this.db, forUpdate = false): Promise<EmailTokenRow | null> {
    const query = ex
      .select()
      .from(emailTokens)
      .where(
        and(
          eq(emailTokens.kind, kind),
          eq(emailTokens.tokenHash, tokenHash),
          isNull(emailTokens.usedAt),
          gt(emailTokens.expiresAt, sql`now()`),
        ),
      );
    const [row] = forUpdate ? await query.for('update') : await query;
    return row ?? null;
  }

  /** Spends every outstanding link of the user (of one kind, or all): a newer link or a new password makes them stale. */
  async spendAllForUser(userId: string, ex: DbExecutor = this.db, kind?: EmailTokenKind): Promise<void> {
    await ex
      .update(emailTokens)
      .set({ usedAt: new Date() })
      .where(and(eq(emailTokens.userId, userId), isNull(emailTokens.usedAt), kind ? eq(emailTokens.kind, kind) : undefined));
  }
}
