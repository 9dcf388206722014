import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

/** Deletes rows that no longer decide anything. Each method returns how many rows it removed. */
@Injectable()
export class HousekeepingRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /**
   * Refresh tokens past their (absolute) expiry. A used or revoked token is kept until then: its
   * family must still be recognised if a leaked copy is presented.
   */
  async purgeExpiredRefreshTokens(ex: DbExecutor = this.db): Promise<number> {
    return (await ex.execute(sql`DELETE FROM refresh_tokens WHERE expires_at < now()`)).rowCount ?? 0;
  }

  /** E-mailed links that expired or were spent more than a day ago. */
  async purgeStaleEmailTokens(ex: DbExecutor = this.db): Promise<number> {
    const result = await ex.execute(sql`
      DELETE FROM email_tokens WHERE expires_at < now() - interval '1 day' OR used_at < now() - interval '1 day'`);
    return result.rowCount ?? 0;
  }

  /** Rate-limit windows that closed over an hour ago and hold no running delay. */
  async purgeClosedRateLimits(ex: DbExecutor = this.db): Promise<number> {
    const result = await ex.execute(sql`
      DELETE FROM rate_limits WHERE reset_at < now() - interval '1 hour' AND (blocked_until IS NULL OR blocked_until < now())`);
    return result.rowCount ?? 0;
  }

  /** Applied sync mutations older than the retention (their replay protection is given up). */
  async purgeAppliedSyncMutations(retentionDays: number, ex: DbExecutor = this.db): Promise<number> {
    const result = await ex.execute(sql`
      DELETE FROM sync_mutations WHERE applied_at < now() - (${retentionDays}::int * interval '1 day')`);
    return result.rowCount ?? 0;
  }
}
