import { Inject, Injectable } from '@nestjs/common';
import { type SQL, sql } from 'drizzle-orm';
import { REPEAT_LOCATION_DAYS, REPEAT_LOCATION_MIN, type RiskBand } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

export interface WeekBandCount { weekStart: Date; band: RiskBand; count: number }

/** Only findings on the site's scaffolds, when a site is asked for. */
function onSite(organisationId: string, siteId: string | undefined, column: SQL): SQL {
  return siteId ? sql`AND ${column} IN (SELECT id FROM scaffolds WHERE organisation_id = ${organisationId} AND site_id = ${siteId})` : sql``;
}

/** Weeks are ISO weeks (Monday first) in UTC, so every replica and every viewer counts the same. */
@Injectable()
export class TrendsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  // Each query groups on the week's timestamp and formats only the few groups it returns: formatting
  // every row (to_char per finding) cost more than the scan itself. The findings it reads come from
  // findings_trends_idx alone (an index-only scan): organisation, raised time, band, position, id.

  async raisedPerWeek(organisationId: string, since: Date, siteId?: string, ex: DbExecutor = this.db): Promise<WeekBandCount[]> {
    const result = await ex.execute<{ week: string; band: RiskBand; count: number }>(sql`
      SELECT to_char(week, 'YYYY-MM-DD') AS week, band, count FROM (
        SELECT date_trunc('week', created_at AT TIME ZONE 'UTC') AS week, risk_band AS band, count(*)::int AS count
        FROM findings
        WHERE organisation_id = ${organisationId} AND created_at >= ${since.toISOString()}::timestamptz
        ${onSite(organisationId, siteId, sql`scaffold_id`)}
        GROUP BY 1, 2
      ) weekly`);
    return result.rows.map((r) => ({ weekStart: new Date(`${r.week}T00:00:00Z`), band: r.band, count: r.count }));
  }

  /** Closed = verified by a second person; a finding verified twice in a week counts once. */
  async closedPerWeek(organisationId: string, since: Date, siteId?: string, ex: DbExecutor = this.db): Promise<WeekBandCount[]> {
    // DISTINCT (week, band, finding) then count: the same as count(DISTINCT finding) per week and
    // band (a finding has one band), without a sort of every verification.
    const result = await ex.execute<{ week: string; band: RiskBand; count: number }>(sql`
      SELECT to_char(week, 'YYYY-MM-DD') AS week, band, count(*)::int AS count FROM (
        SELECT DISTINCT date_trunc('week', v.verified_at AT TIME ZONE 'UTC') AS week, f.risk_band AS band, v.finding_id
        FROM verifications v JOIN findings f ON f.id = v.finding_id AND f.organisation_id = v.organisation_id
        WHERE v.organisation_id = ${organisationId} AND v.outcome = 'verified' AND v.verified_at >= ${since.toISOString()}::timestamptz
        ${onSite(organisationId, siteId, sql`f.scaffold_id`)}
      ) closed
      GROUP BY week, band`);
    return result.rows.map((r) => ({ weekStart: new Date(`${r.week}T00:00:00Z`), band: r.band, count: r.count }));
  }

  /** Median hours from raising to the first fix, for first fixes since `since`, by band. */
  async timeToFix(organisationId: string, since: Date, siteId?: string, ex: DbExecutor = this.db) {
    // The first fixes and their hours are sorted in memory (PostgreSQL's default 4 MB spills to disk
    // from about 50,000 fixes); date_part gives float8 hours where extract's numeric is several times slower.
    const result = await ex.transaction(async (tx) => {
      await tx.execute(sql`SET LOCAL work_mem = '16MB'`);
      return tx.execute<{ band: RiskBand; median_hours: number | null; fixes: number }>(sql`
      WITH first_fix AS (
        -- Only fixes in the period, and only where no earlier fix exists: the first fix, without grouping every fix ever made.
        SELECT x.finding_id, min(x.fixed_at) AS fixed_at FROM fixes x
        WHERE x.organisation_id = ${organisationId} AND x.fixed_at >= ${since.toISOString()}::timestamptz
          AND NOT EXISTS (SELECT 1 FROM fixes e WHERE e.organisation_id = x.organisation_id AND e.finding_id = x.finding_id AND e.fixed_at < ${since.toISOString()}::timestamptz)
        GROUP BY x.finding_id
      )
      SELECT f.risk_band AS band,
        percentile_cont(0.5) WITHIN GROUP (ORDER BY date_part('epoch', ff.fixed_at - f.created_at) / 3600.0) AS median_hours,
        count(*)::int AS fixes
      FROM first_fix ff JOIN findings f ON f.id = ff.finding_id AND f.organisation_id = ${organisationId}
      WHERE true ${onSite(organisationId, siteId, sql`f.scaffold_id`)}
      GROUP BY f.risk_band`);
    });
    return result.rows.map((r) => ({ band: r.band, medianHours: r.median_hours, fixes: r.fixes }));
  }

  /** The same scaffold, lift and bay with REPEAT_LOCATION_MIN findings or more in the last REPEAT_LOCATION_DAYS days. */
  async repeatLocations(organisationId: string, siteId?: string, ex: DbExecutor = this.db) {
    const result = await ex.execute<{
      scaffold_id: string; reference: string; site_name: string; lift: number; bay: number; elevations: string[]; findings: number; last_raised_at: string;
    }>(sql`
      -- Per elevation first (a hash of a few hundred groups), then per bay: the same elevations and
      -- counts as array_agg(DISTINCT) over every finding, without sorting every finding.
      WITH per_elevation AS (
        SELECT scaffold_id, lift, bay, elevation, count(*) AS findings, max(created_at) AS last_raised_at
        FROM findings
        WHERE organisation_id = ${organisationId} AND created_at >= now() - make_interval(days => ${REPEAT_LOCATION_DAYS})
        ${onSite(organisationId, siteId, sql`scaffold_id`)}
        GROUP BY scaffold_id, lift, bay, elevation
      ), repeats AS (
        SELECT scaffold_id, lift, bay, array_agg(elevation ORDER BY elevation) AS elevations, sum(findings)::int AS findings,
          max(last_raised_at) AS last_raised_at
        FROM per_elevation
        GROUP BY scaffold_id, lift, bay
        HAVING sum(findings) >= ${REPEAT_LOCATION_MIN}
      )
      SELECT r.scaffold_id::text AS scaffold_id, sc.reference, s.name AS site_name, r.lift, r.bay, r.elevations, r.findings,
        to_json(r.last_raised_at)#>>'{}' AS last_raised_at
      FROM repeats r JOIN scaffolds sc ON sc.id = r.scaffold_id JOIN sites s ON s.id = sc.site_id
      ORDER BY r.findings DESC, r.last_raised_at DESC, r.scaffold_id, r.lift, r.bay
      LIMIT 100`);
    return result.rows.map((r) => ({
      scaffoldId: r.scaffold_id,
      scaffoldReference: r.reference,
      siteName: r.site_name,
      lift: r.lift,
      bay: r.bay,
      elevations: r.elevations,
      findings: r.findings,
      lastRaisedAt: new Date(r.last_raised_at).toISOString(),
    }));
  }
}
