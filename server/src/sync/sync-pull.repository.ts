import { Inject, Injectable } from '@nestjs/common';
import type { SyncPullFormat } from '@plummet/shared';
import { and, asc, eq, sql, type AnyColumn } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { findings, scaffolds, syncConflicts } from '../db/schema/index.js';
import { readOtherTables, type FeedScope, type StampedChange } from './sync-feed-tables.js';
import { RawJson } from './raw-json.js';
import { idIn } from './sync-batch.repository.js';
import { syncFindingJson } from './sync-finding-json.js';
import { toSyncConflict } from './sync.mapper.js';
import { conflictWriterNames } from './sync.repository.js';

/** (xid, seq) order of the feed; xid8 travels as decimal text, so compare it as a BigInt. */
export function feedOrder(a: { xid: string; seq: number }, b: { xid: string; seq: number }): number {
  const x = BigInt(a.xid) - BigInt(b.xid);
  return x < 0n ? -1 : x > 0n ? 1 : a.seq - b.seq;
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
 *
 * Each table's part of the feed is read with its rows in one query. Both queries MUST run in one
 * REPEATABLE READ transaction: there every statement sees the transaction's one snapshot, so
 * `pg_current_snapshot()` — and with it the horizon — is the same for both, and the merged page is
 * a prefix of one consistent feed.
 */
@Injectable()
export class SyncPullRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /**
   * Up to `limit` changes after `after`, oldest first, each with its record (call inside a
   * REPEATABLE READ transaction). Each table gives its first `limit` rows of the window; merged in
   * (xid, seq) order, the first `limit` of the union is a prefix of the whole feed.
   */
  async changes(
    scope: FeedScope,
    after: { xid: string; seq: number },
    limit: number,
    tx: DbExecutor,
    format: SyncPullFormat = 'records',
    now = Date.now(),
  ): Promise<StampedChange[]> {
    const horizon = sql`pg_snapshot_xmin(pg_current_snapshot())`;
    const window = (xid: AnyColumn, seq: AnyColumn) =>
      sql`(${xid}, ${seq}) > (${after.xid}::xid8, ${after.seq}::bigint) and ${xid} < ${horizon}`;
    const { organisationId, foremanId } = scope;
    const others = readOtherTables(tx, scope, window, limit);
    const findingsInWindow = and(eq(findings.organisationId, organisationId), window(findings.syncXid, findings.syncSeq));
    const conflictsInWindow = and(eq(syncConflicts.organisationId, organisationId), window(syncConflicts.syncXid, syncConflicts.syncSeq));
    // Which tables have rows in the window, in one statement; only those are read. The same statement
    // turns sorting off for the rest of this read-only transaction: every read below wants its rows
    // in feed order from the table's feed index, stopping at the limit. PostgreSQL cannot estimate
    // how many rows lie past an xid8 cursor, and with a low guess it would rather sort every row of
    // the organisation after the cursor (turning each one's record into text first) than walk the index.
    const probes = [sql`exists (select 1 from ${findings} where ${findingsInWindow})`, sql`exists (select 1 from ${syncConflicts} where ${conflictsInWindow})`, ...others.map((r) => r.changed)];
    const [probe] = (
      await tx.execute<{ changed: boolean[] }>(sql`select set_config('enable_sort', 'off', true), array[${sql.join(probes, sql`, `)}] as changed`)
    ).rows;
    const [findingsChanged, conflictsChanged, ...othersChanged] = probe!.changed;
    // Each finding comes as its record's JSON text, written by PostgreSQL (sync-finding-json.ts), with
    // what the feed and the versions handed out need beside it: no cell is decoded here.
    const scoped = foremanId ? sql`and (s.foreman_id = ${foremanId} or findings.assignee_id = ${foremanId})` : sql``;
    const onSite = scope.siteId ? sql`and s.site_id = ${scope.siteId}` : sql``;
    const found = findingsChanged
      ? await tx.execute<{ record: string; id: string; version: number; feed_xid: string; feed_seq: string }>(sql`
      select ${syncFindingJson('findings', 's.site_id', now, format)} as record, findings.id, findings.version,
        findings.sync_xid::text as feed_xid, findings.sync_seq as feed_seq
      from findings join scaffolds s on s.id = findings.scaffold_id
      where findings.organisation_id = ${organisationId} and ${window(findings.syncXid, findings.syncSeq)} and s.archived_at is null ${scoped} ${onSite}
      order by findings.sync_xid, findings.sync_seq
      limit ${limit}`)
      : { rows: [] };
    // A foreman sees no conflicts: settling them is for inspectors and managers.
    const conflicts =
      foremanId || !conflictsChanged
        ? []
        : await tx.select().from(syncConflicts).where(conflictsInWindow).orderBy(asc(syncConflicts.syncXid), asc(syncConflicts.syncSeq)).limit(limit);
    // One connection runs one statement at a time (pg refuses overlapping queries): one after another.
    const otherRows: StampedChange[][] = [];
    for (const [i, reader] of others.entries()) if (othersChanged[i]) otherRows.push(await reader.read());
    const out: StampedChange[] = found.rows.map((r) => ({
      xid: r.feed_xid,
      seq: Number(r.feed_seq),
      change: format === 'rows' ? { type: 'finding', row: new RawJson(r.record) } : { type: 'finding', record: new RawJson(r.record) },
      given: { id: r.id, version: r.version },
    }));
    const names = await conflictWriterNames(conflicts, tx);
    for (const c of conflicts) out.push({ xid: c.syncXid, seq: c.syncSeq, change: { type: 'conflict', record: toSyncConflict(c, names) } });
    for (const part of otherRows) out.push(...part);
    return out.sort(feedOrder).slice(0, limit);
  }

  /** Findings with the site of their scaffold (the phone files findings by site). */
  async findingsWithSite(ids: string[], executor: DbExecutor = this.db) {
    if (!ids.length) return [];
    return executor
      .select({ finding: findings, siteId: scaffolds.siteId, scaffoldForemanId: scaffolds.foremanId })
      .from(findings)
      .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
      .where(idIn(ids));
  }
}
