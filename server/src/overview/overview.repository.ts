import { Inject, Injectable } from '@nestjs/common';
import { type SQL, sql } from 'drizzle-orm';
import type { RiskBand, Role, ScaffoldStatus } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

export interface SiteFindingCounts { siteId: string; band: RiskBand; open: number; overdue: number; fixed: number }
export interface SiteScaffoldCounts { siteId: string; status: ScaffoldStatus; scaffolds: number; dueToday: number; overdue: number }

/**
 * The overview's aggregates, each one GROUP BY in PostgreSQL: no finding row leaves the database.
 * Findings are grouped by scaffold first (an index-only scan of findings_overview_idx), then by site.
 */
@Injectable()
export class OverviewRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async sites(organisationId: string, siteId?: string, ex: DbExecutor = this.db): Promise<{ id: string; name: string }[]> {
    const result = await ex.execute<{ id: string; name: string }>(sql`
      SELECT id::text AS id, name FROM sites
      WHERE organisation_id = ${organisationId} ${siteId ? sql`AND id = ${siteId}` : sql``}
      ORDER BY name, id`);
    return result.rows;
  }

  async people(organisationId: string, ex: DbExecutor = this.db): Promise<{ id: string; name: string; role: Role }[]> {
    const result = await ex.execute<{ id: string; name: string; role: Role }>(sql`
      SELECT u.id::text AS id, u.name, m.role::text AS role
      FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.organisation_id = ${organisationId} AND u.active
      ORDER BY u.name, u.id`);
    return result.rows;
  }

  async findingCounts(organisationId: string, siteId?: string, ex: DbExecutor = this.db): Promise<SiteFindingCounts[]> {
    const result = await ex.execute<{ site_id: string; band: RiskBand; open: number; overdue: number; fixed: number }>(sql`
      WITH per_scaffold AS (
        SELECT scaffold_id, risk_band,
          count(*) FILTER (WHERE state IN ('open', 'made-safe')) AS open,
          count(*) FILTER (WHERE state IN ('open', 'made-safe') AND due_at < now()) AS overdue,
          count(*) FILTER (WHERE state = 'fixed') AS fixed
        FROM findings
        WHERE organisation_id = ${organisationId} AND state IN ('open', 'made-safe', 'fixed')
        GROUP BY scaffold_id, risk_band
      )
      SELECT sc.site_id::text AS site_id, p.risk_band AS band,
        sum(p.open)::int AS open, sum(p.overdue)::int AS overdue, sum(p.fixed)::int AS fixed
      FROM per_scaffold p JOIN scaffolds sc ON sc.id = p.scaffold_id
      ${siteScope(siteId)}
      GROUP BY sc.site_id, p.risk_band`);
    return result.rows.map((r) => ({ siteId: r.site_id, band: r.band, open: r.open, overdue: r.overdue, fixed: r.fixed }));
  }

  /** Scaffolds by tag status, and their next inspections: due later today in the site's own time zone, or past. */
  async scaffoldCounts(organisationId: string, siteId?: string, ex: DbExecutor = this.db): Promise<SiteScaffoldCounts[]> {
    const result = await ex.execute<{ site_id: string; status: ScaffoldStatus; scaffolds: number; due_today: number; overdue: number }>(sql`
      SELECT sc.site_id::text AS site_id, sc.status, count(*)::int AS scaffolds,
        count(*) FILTER (WHERE sc.next_due_at >= now()
          AND (sc.next_due_at AT TIME ZONE s.time_zone)::date = (now() AT TIME ZONE s.time_zone)::date)::int AS due_today,
        count(*) FILTER (WHERE sc.next_due_at < now())::int AS overdue
      FROM scaffolds sc JOIN sites s ON s.id = sc.site_id
      WHERE sc.organisation_id = ${organisationId} ${siteId ? sql`AND sc.site_id = ${siteId}` : sql``}
      GROUP BY sc.site_id, sc.status`);
    return result.rows.map((r) => ({ siteId: r.site_id, status: r.status, scaffolds: r.scaffolds, dueToday: r.due_today, overdue: r.overdue }));
  }

  /** Open conflicts per site (every conflict is on a finding, whose scaffold names the site). */
  async openConflicts(organisationId: string, siteId?: string, ex: DbExecutor = this.db): Promise<{ siteId: string; count: number }[]> {
    const result = await ex.execute<{ site_id: string; count: number }>(sql`
      SELECT sc.site_id::text AS site_id, count(*)::int AS count
      FROM sync_conflicts c
      JOIN findings f ON f.id = c.entity_id AND c.entity = 'finding'
      JOIN scaffolds sc ON sc.id = f.scaffold_id
      WHERE c.organisation_id = ${organisationId} AND c.status = 'open'
      ${siteId ? sql`AND sc.site_id = ${siteId}` : sql``}
      GROUP BY sc.site_id`);
    return result.rows.map((r) => ({ siteId: r.site_id, count: r.count }));
  }
}

function siteScope(siteId?: string): SQL {
  return siteId ? sql`WHERE sc.site_id = ${siteId}` : sql``;
}
