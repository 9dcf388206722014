import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

/** Deletes rows that no longer decide anything. Each method returns how many rows it removed. */
@Injectable()
export class HousekeepingRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /**
   * Across organisations, by age only, through the function housekeeping_purge (row-level
   * security would show this process no organisation's rows):
   * - refresh tokens past their (absolute) expiry (a used or revoked token is kept until then: its
   *   family must still be recognised if a leaked copy is presented);
   * - e-mailed links that expired or were spent more than a day ago;
   * - applied sync mutations older than the retention (their replay protection is given up).
   */
  async purgeOrganisationRows(syncRetentionDays: number, ex: DbExecutor = this.db): Promise<{ refreshTokens: number; emailTokens: number; syncMutations: number }> {
    const result = await ex.execute<{ refresh_tokens: string; email_tokens: string; sync_mutations: string }>(
      sql`SELECT * FROM housekeeping_purge(${syncRetentionDays}::int)`,
    );
    const row = result.rows[0];
    return { refreshTokens: Number(row?.refresh_tokens ?? 0), emailTokens: Number(row?.email_tokens ?? 0), syncMutations: Number(row?.sync_mutations ?? 0) };
  }

  /** Rate-limit windows that closed over an hour ago and hold no running delay. */
  async purgeClosedRateLimits(ex: DbExecutor = this.db): Promise<number> {
    const result = await ex.execute(sql`
      DELETE FROM rate_limits WHERE reset_at < now() - interval '1 hour' AND (blocked_until IS NULL OR blocked_until < now())`);
    return result.rowCount ?? 0;
  }
}
