import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

export interface WindowHit {
  /** Hits in the current window, this one included. */
  count: number;
  /** Seconds until the window closes, by the database's clock (the same for every replica). */
  retryAfterS: number;
}

@Injectable()
export class RateLimitRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** Counts one hit in a fixed window, atomically: concurrent hits from any replica each get their own count. */
  async hit(key: string, windowS: number, ex: DbExecutor = this.db): Promise<WindowHit> {
    const result = await ex.execute<{ count: number; retry_after_s: number }>(sql`
      INSERT INTO rate_limits (key, "count", reset_at)
      VALUES (${key}, 1, now() + (${windowS}::int * interval '1 second'))
      ON CONFLICT (key) DO UPDATE SET
        "count" = CASE WHEN rate_limits.reset_at <= now() THEN 1 ELSE rate_limits."count" + 1 END,
        reset_at = CASE WHEN rate_limits.reset_at <= now() THEN excluded.reset_at ELSE rate_limits.reset_at END
      RETURNING "count", greatest(1, ceil(extract(epoch FROM reset_at - now())))::int AS retry_after_s`);
    const row = result.rows[0];
    return { count: Number(row.count), retryAfterS: Number(row.retry_after_s) };
  }

  /**
   * One attempt under a growing delay: `freeAttempts` in a quiet period pass at once; from the
   * last of them on, each sets a wait of baseDelayS·2ⁿ (n = 0, 1, …; at most maxDelayS) before
   * the next is taken. The caller clears the key after a success. Null when
   * taken; the seconds to wait when refused. One UPDATE per attempt: concurrent attempts from any
   * replica are serialised on the row, and a refused attempt changes nothing.
   */
  async attemptWithDelay(
    key: string,
    rule: { freeAttempts: number; quietS: number; baseDelayS: number; maxDelayS: number },
    ex: DbExecutor = this.db,
  ): Promise<number | null> {
    await ex.execute(sql`INSERT INTO rate_limits (key, "count", reset_at) VALUES (${key}, 0, now()) ON CONFLICT (key) DO NOTHING`);
    // Every value is computed from the row being updated, never from a sub-query: when attempts
    // race, PostgreSQL re-reads the locked row for the later UPDATE, but a sub-query (or CTE) would
    // keep its first snapshot, and two attempts would then store the same count.
    const n = sql`(CASE WHEN reset_at <= now() THEN 1 ELSE "count" + 1 END)`;
    const taken = await ex.execute<{ count: number }>(sql`
      UPDATE rate_limits SET
        "count" = ${n},
        reset_at = now() + (${rule.quietS}::int * interval '1 second'),
        blocked_until = CASE WHEN ${n} >= ${rule.freeAttempts}::int
          THEN now() + least(${rule.maxDelayS}::float8, ${rule.baseDelayS}::float8 * power(2, ${n} - ${rule.freeAttempts}::int)) * interval '1 second'
          ELSE NULL END
      WHERE key = ${key} AND (blocked_until IS NULL OR blocked_until <= now() OR reset_at <= now())
      RETURNING "count"`);
    if (taken.rows.length > 0) return null;
    const wait = await ex.execute<{ s: number }>(
      sql`SELECT greatest(1, ceil(extract(epoch FROM blocked_until - now())))::int AS s FROM rate_limits WHERE key = ${key}`,
    );
    return Number(wait.rows[0]?.s ?? 1);
  }

  /** Gives back one hit of the current window (an attempt that turned out legitimate). */
  async refund(key: string, ex: DbExecutor = this.db): Promise<void> {
    await ex.execute(sql`UPDATE rate_limits SET "count" = greatest(0, "count" - 1) WHERE key = ${key}`);
  }

  async clear(key: string, ex: DbExecutor = this.db): Promise<void> {
    await ex.execute(sql`DELETE FROM rate_limits WHERE key = ${key}`);
  }

  /** Drops windows that closed a while ago (they would restart at 1 anyway); returns how many. */
  async purgeExpired(ex: DbExecutor = this.db): Promise<number> {
    const result = await ex.execute(sql`
      DELETE FROM rate_limits WHERE reset_at < now() - interval '1 hour' AND (blocked_until IS NULL OR blocked_until < now())`);
    return result.rowCount ?? 0;
  }
}
