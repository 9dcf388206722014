import { Injectable } from '@nestjs/common';
import { type ScaffoldReports, type ScaffoldReportsQuery, ScaffoldStatusSchema } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { ScaffoldReportsRepository } from './scaffold-reports.repository.js';

@Injectable()
export class ScaffoldReportsService {
  constructor(private readonly reports: ScaffoldReportsRepository) {}

  async list(user: AuthUser, query: ScaffoldReportsQuery): Promise<ScaffoldReports> {
    const scaffold = await this.reports.scaffold(user.organisationId, query.scaffoldId);
    if (!scaffold) throw AppError.notFound('Scaffold');
    const rows = await this.reports.inspections(user.organisationId, query.scaffoldId, query.limit);
    return {
      scaffoldId: query.scaffoldId,
      scaffoldReference: scaffold.reference,
      siteName: scaffold.site_name,
      currentStatus: scaffold.status,
      items: rows.map((r) => ({
        inspectionId: r.inspection_id,
        startedAt: new Date(r.started_at).toISOString(),
        finishedAt: r.finished_at ? new Date(r.finished_at).toISOString() : null,
        inspectorId: r.inspector_id,
        inspectorName: r.inspector_name,
        reason: r.reason,
        findingsCount: r.findings_count,
        // An audit entry written before a status was renamed would not parse: show nothing rather than fail.
        statusGiven: ScaffoldStatusSchema.safeParse(r.status_given).data ?? null,
      })),
    };
  }
}
