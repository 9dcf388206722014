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

  async clear(key: string, ex: DbExecutor = this.db): Promise<void> {
    await ex.execute(sql`DELETE FROM rate_limits WHERE key = ${key}`);
  }

  /** Drops windows that closed a while ago (they would restart at 1 anyway). */
  async purgeExpired(ex: DbExecutor = this.db): Promise<void> {
    await ex.execute(sql`DELETE FROM rate_limits WHERE reset_at < now() - interval '1 hour'`);
  }
}
