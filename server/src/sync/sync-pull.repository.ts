import { Inject, Injectable } from '@nestjs/common';
import { eq, inArray, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { findings, scaffolds, syncConflicts } from '../db/schema/index.js';

export interface FeedEntry {
  type: 'finding' | 'conflict';
  id: string;
  xid: string;
  seq: number;
}

/**
 * The change feed. Every synced row carries `sync_xid` (the writing transaction's id, xid8) and
 * `sync_seq` (nextval of one sequence), both set by column defaults and Drizzle's `$onUpdate` in the
 * writing transaction (server/src/db/schema/sync.table.ts).
 *
 * Why this never skips a row that commits late: sequence (and xid) order is not commit order; a
 * transaction can take a stamp, stay open, and commit after a later stamp was already handed out.
 * A reader therefore returns only rows whose transaction id is below `pg_snapshot_xmin(pg_current_snapshot())`,
 * the oldest transaction still running when its snapshot was taken. Every transaction below that
 * horizon has ended, and every transaction that starts later gets a larger id, so the set of rows
 * with xid below a horizon can only lose rows (to later updates, which reappear above it) and never
 * gain one. The feed is ordered by (xid, seq); a cursor `(xid, seq)` therefore marks a prefix that
 * is complete forever. Rows of transactions still in flight (or committed above the horizon) wait
 * for the next pull. A long-running transaction delays the feed; it never loses a change.
 * Unlike an advisory lock around stamping, writers never wait for each other.
 */
@Injectable()
export class SyncPullRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async feed(organisationId: string, after: { xid: string; seq: number }, limit: number, foremanId?: string, executor: DbExecutor = this.db): Promise<FeedEntry[]> {
    const horizon = sql`pg_snapshot_xmin(pg_current_snapshot())`;
    const afterFinding = sql`(f.sync_xid, f.sync_seq) > (${after.xid}::xid8, ${after.seq}::bigint)`;
    const afterConflict = sql`(c.sync_xid, c.sync_seq) > (${after.xid}::xid8, ${after.seq}::bigint)`;
    const foremanFindings = foremanId ? sql`and (s.foreman_id = ${foremanId} or f.assignee_id = ${foremanId})` : sql``;
    // A foreman sees no conflicts: settling them is for inspectors and managers.
    const conflicts = foremanId
      ? sql``
      : sql`union all
        select 'conflict' as type, c.id, c.sync_xid as xid, c.sync_seq as seq from sync_conflicts c
        where c.organisation_id = ${organisationId} and ${afterConflict} and c.sync_xid < ${horizon}`;
    const result = await executor.execute<{ type: 'finding' | 'conflict'; id: string; xid: string; seq: string }>(sql`
      select type, id, xid::text as xid, seq from (
        select 'finding' as type, f.id, f.sync_xid as xid, f.sync_seq as seq
        from findings f join scaffolds s on s.id = f.scaffold_id
        where f.organisation_id = ${organisationId} and ${afterFinding} and f.sync_xid < ${horizon} ${foremanFindings}
        ${conflicts}
      ) feed
      order by feed.xid, feed.seq
      limit ${limit}`);
    return result.rows.map((r) => ({ type: r.type, id: r.id, xid: r.xid, seq: Number(r.seq) }));
  }

  /** Findings with the site of their scaffold (the phone files findings by site). */
  async findingsWithSite(ids: string[], executor: DbExecutor = this.db) {
    if (!ids.length) return [];
    return executor
      .select({ finding: findings, siteId: scaffolds.siteId, scaffoldForemanId: scaffolds.foremanId })
      .from(findings)
      .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
      .where(inArray(findings.id, ids));
  }

  async conflicts(ids: string[], executor: DbExecutor = this.db) {
    if (!ids.length) return [];
    return executor.select().from(syncConflicts).where(inArray(syncConflicts.id, ids));
  }
}
