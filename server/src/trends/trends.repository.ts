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

  /**
   * Median hours from raising to the first fix, for findings first fixed since `since`, by band.
   * findings.first_fixed_at (kept by triggers on fixes) makes it one index-only scan: no join of
   * fixes, no grouping per finding. date_part gives float8 hours (extract's numeric is several times slower).
   */
  async timeToFix(organisationId: string, since: Date, siteId?: string, ex: DbExecutor = this.db) {
    // One row, a median per band: each sorts only its own band's hours (no sort of every fix by band
    // first, and a third of the memory each, so 50,000 fixes still sort within the default work_mem).
    const median = (band: RiskBand) => sql`percentile_cont(0.5) WITHIN GROUP (ORDER BY hours) FILTER (WHERE band = ${band})`;
    const count = (band: RiskBand) => sql`(count(*) FILTER (WHERE band = ${band}))::int`;
    const result = await ex.execute<Record<'low' | 'medium' | 'high', number | null> & Record<'low_n' | 'medium_n' | 'high_n', number>>(sql`
      SELECT ${median('Low')} AS low, ${count('Low')} AS low_n, ${median('Medium')} AS medium, ${count('Medium')} AS medium_n,
        ${median('High')} AS high, ${count('High')} AS high_n
      FROM (
        SELECT risk_band AS band, date_part('epoch', first_fixed_at - created_at) / 3600.0 AS hours
        FROM findings
        WHERE organisation_id = ${organisationId} AND first_fixed_at >= ${since.toISOString()}::timestamptz
        ${onSite(organisationId, siteId, sql`scaffold_id`)}
      ) first_fixes`);
    const row = result.rows[0];
    return (['Low', 'Medium', 'High'] as const)
      .map((band) => {
        const key = band.toLowerCase() as 'low' | 'medium' | 'high';
        return { band, medianHours: row[key], fixes: row[`${key}_n`] };
      })
      .filter((t) => t.fixes > 0);
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
