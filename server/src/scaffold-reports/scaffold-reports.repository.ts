import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import type { ScaffoldStatus } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';

export type ScaffoldReportRow = {
  inspection_id: string;
  started_at: string;
  finished_at: string | null;
  inspector_id: string;
  inspector_name: string;
  reason: string;
  findings_count: number;
  status_given: ScaffoldStatus | null;
};

@Injectable()
export class ScaffoldReportsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async scaffold(organisationId: string, scaffoldId: string, ex: DbExecutor = this.db) {
    const result = await ex.execute<{ reference: string; site_name: string; status: ScaffoldStatus }>(sql`
      SELECT sc.reference, s.name AS site_name, sc.status
      FROM scaffolds sc JOIN sites s ON s.id = sc.site_id
      WHERE sc.organisation_id = ${organisationId} AND sc.id = ${scaffoldId}`);
    return result.rows[0];
  }

  /**
   * The scaffold's inspections, newest first, with their findings count and the tag status in
   * force when each finished (the last status change recorded up to then, from the audit trail).
   */
  async inspections(organisationId: string, scaffoldId: string, limit: number, ex: DbExecutor = this.db): Promise<ScaffoldReportRow[]> {
    const result = await ex.execute<ScaffoldReportRow>(sql`
      SELECT i.id::text AS inspection_id, to_json(i.started_at)#>>'{}' AS started_at, to_json(i.finished_at)#>>'{}' AS finished_at,
        i.inspector_id::text AS inspector_id, u.name AS inspector_name, i.reason::text AS reason,
        (SELECT count(*)::int FROM findings f WHERE f.inspection_id = i.id) AS findings_count,
        CASE WHEN i.finished_at IS NULL THEN NULL ELSE (
          SELECT a.after->>'status' FROM audit_events a
          WHERE a.organisation_id = i.organisation_id AND a.entity_type = 'scaffold' AND a.entity_id = i.scaffold_id::text
            AND a.action IN ('create', 'status') AND a.at <= i.finished_at
          ORDER BY a.at DESC, a.id DESC LIMIT 1
        ) END AS status_given
      FROM inspections i JOIN users u ON u.id = i.inspector_id
      WHERE i.organisation_id = ${organisationId} AND i.scaffold_id = ${scaffoldId}
      ORDER BY i.started_at DESC, i.id DESC
      LIMIT ${limit}`);
    return result.rows;
  }
}
