import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import type { RiskBand } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../../db/db.tokens.js';

export type DigestRecipient = { id: string; name: string; email: string; role: 'manager' | 'foreman' };
export type OpenCount = { siteId: string; siteName: string; band: RiskBand; count: number };
export type OverdueFix = { siteId: string; siteName: string; itemName: string; scaffoldReference: string; band: RiskBand; dueAt: Date };
export type DueScaffold = { siteId: string; siteName: string; reference: string; nextDueAt: Date; overdue: boolean; timeZone: string };

/** Unfinished findings: open, or made safe for now but not yet fixed. */
const UNFINISHED = sql`f.state IN ('open', 'made-safe')`;

/**
 * What a daily digest reads, each as of a given instant (the tick's clock, so a digest describes
 * the moment it was queued). `foremanId` narrows to a foreman's scope: findings on their scaffolds
 * or assigned to them, and their own scaffolds. Archived scaffolds are left out.
 */
@Injectable()
export class DigestRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** Every organisation's id, across organisations (the function digest_organisation_ids), for the tick. */
  async organisationIds(ex: DbExecutor = this.db): Promise<string[]> {
    const result = await ex.execute<{ id: string }>(sql`SELECT id::text AS id FROM digest_organisation_ids() AS id`);
    return result.rows.map((r) => r.id);
  }

  /** The organisations in scope (row-level security: the current one). */
  async organisations(ex: DbExecutor = this.db): Promise<{ id: string; name: string; settings: unknown }[]> {
    const result = await ex.execute<{ id: string; name: string; settings: unknown }>(sql`SELECT id::text AS id, name, settings FROM organisations ORDER BY id`);
    return result.rows;
  }

  /** Claims the organisation's digest of one local day; false when another run already has. */
  async claim(organisationId: string, localDate: string, ex: DbExecutor): Promise<boolean> {
    const result = await ex.execute(sql`
      INSERT INTO digest_runs (organisation_id, local_date) VALUES (${organisationId}, ${localDate}::date)
      ON CONFLICT DO NOTHING RETURNING organisation_id`);
    return result.rows.length === 1;
  }

  async recipients(organisationId: string, ex: DbExecutor = this.db): Promise<DigestRecipient[]> {
    const result = await ex.execute<DigestRecipient>(sql`
      SELECT u.id::text AS id, u.name, u.email, m.role::text AS role
      FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.organisation_id = ${organisationId} AND u.active AND m.role IN ('manager', 'foreman')
      ORDER BY u.email`);
    return result.rows;
  }

  async recipient(organisationId: string, userId: string, ex: DbExecutor = this.db): Promise<DigestRecipient | undefined> {
    return (await this.recipients(organisationId, ex)).find((r) => r.id === userId);
  }

  async openCounts(organisationId: string, at: Date, foremanId?: string, ex: DbExecutor = this.db): Promise<OpenCount[]> {
    const result = await ex.execute<OpenCount>(sql`
      SELECT s.id::text AS "siteId", s.name AS "siteName", f.risk_band::text AS band, count(*)::int AS count
      FROM findings f JOIN scaffolds sc ON sc.id = f.scaffold_id JOIN sites s ON s.id = sc.site_id
      WHERE f.organisation_id = ${organisationId} AND ${UNFINISHED} AND sc.archived_at IS NULL
        ${foremanId ? sql`AND (sc.foreman_id = ${foremanId} OR f.assignee_id = ${foremanId})` : sql``}
      GROUP BY s.id, s.name, f.risk_band`);
    return result.rows;
  }

  async overdueFixes(organisationId: string, at: Date, foremanId?: string, ex: DbExecutor = this.db): Promise<OverdueFix[]> {
    const result = await ex.execute<Omit<OverdueFix, 'dueAt'> & { dueAt: string }>(sql`
      SELECT s.id::text AS "siteId", s.name AS "siteName", f.item_name AS "itemName", sc.reference AS "scaffoldReference",
        f.risk_band::text AS band, f.due_at AS "dueAt"
      FROM findings f JOIN scaffolds sc ON sc.id = f.scaffold_id JOIN sites s ON s.id = sc.site_id
      WHERE f.organisation_id = ${organisationId} AND ${UNFINISHED} AND sc.archived_at IS NULL
        AND f.due_at < ${at.toISOString()}::timestamptz
        ${foremanId ? sql`AND (sc.foreman_id = ${foremanId} OR f.assignee_id = ${foremanId})` : sql``}
      ORDER BY f.risk_score DESC, f.due_at, f.id`);
    return result.rows.map((r) => ({ ...r, dueAt: new Date(r.dueAt) }));
  }

  /** Scaffolds whose next inspection falls on or before the site's own local day of `at`. */
  async dueScaffolds(organisationId: string, at: Date, foremanId?: string, ex: DbExecutor = this.db): Promise<DueScaffold[]> {
    const when = sql`${at.toISOString()}::timestamptz`;
    const result = await ex.execute<Omit<DueScaffold, 'nextDueAt'> & { nextDueAt: string }>(sql`
      SELECT s.id::text AS "siteId", s.name AS "siteName", sc.reference, sc.next_due_at AS "nextDueAt",
        sc.next_due_at < ${when} AS overdue, s.time_zone AS "timeZone"
      FROM scaffolds sc JOIN sites s ON s.id = sc.site_id
      WHERE sc.organisation_id = ${organisationId} AND sc.archived_at IS NULL AND sc.next_due_at IS NOT NULL
        AND (sc.next_due_at AT TIME ZONE s.time_zone)::date <= (${when} AT TIME ZONE s.time_zone)::date
        ${foremanId ? sql`AND sc.foreman_id = ${foremanId}` : sql``}
      ORDER BY sc.next_due_at, sc.reference`);
    return result.rows.map((r) => ({ ...r, nextDueAt: new Date(r.nextDueAt) }));
  }
}
