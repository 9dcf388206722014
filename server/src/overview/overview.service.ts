import { Injectable } from '@nestjs/common';
import { type Overview, type OverviewFigures, type OverviewQuery, SCAFFOLD_STATUSES } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { OverviewRepository } from './overview.repository.js';

function emptyFigures(): OverviewFigures {
  return {
    openByBand: { Low: 0, Medium: 0, High: 0 },
    overdueFixes: 0,
    waitingVerification: 0,
    scaffoldsByStatus: SCAFFOLD_STATUSES.map((status) => ({ status, count: 0 })),
    inspectionsDueToday: 0,
    inspectionsOverdue: 0,
    openConflicts: 0,
  };
}

function add(into: OverviewFigures, from: OverviewFigures): void {
  for (const band of ['Low', 'Medium', 'High'] as const) into.openByBand[band] += from.openByBand[band];
  into.overdueFixes += from.overdueFixes;
  into.waitingVerification += from.waitingVerification;
  from.scaffoldsByStatus.forEach((s, i) => (into.scaffoldsByStatus[i].count += s.count));
  into.inspectionsDueToday += from.inspectionsDueToday;
  into.inspectionsOverdue += from.inspectionsOverdue;
  into.openConflicts += from.openConflicts;
}

@Injectable()
export class OverviewService {
  constructor(private readonly overview: OverviewRepository) {}

  /** Per site from three aggregates; the totals are the sums (every finding and scaffold belongs to one site). */
  async get(user: AuthUser, query: OverviewQuery): Promise<Overview> {
    const org = user.organisationId;
    const [sites, findingCounts, scaffoldCounts, conflicts] = await Promise.all([
      this.overview.sites(org, query.siteId),
      this.overview.findingCounts(org, query.siteId),
      this.overview.scaffoldCounts(org, query.siteId),
      this.overview.openConflicts(org, query.siteId),
    ]);
    if (query.siteId && sites.length === 0) throw AppError.notFound('Site');

    const perSite = new Map(sites.map((s) => [s.id, emptyFigures()]));
    for (const c of findingCounts) {
      const figures = perSite.get(c.siteId);
      if (!figures) continue;
      figures.openByBand[c.band] += c.open;
      figures.overdueFixes += c.overdue;
      figures.waitingVerification += c.fixed;
    }
    for (const c of scaffoldCounts) {
      const figures = perSite.get(c.siteId);
      if (!figures) continue;
      figures.scaffoldsByStatus.find((s) => s.status === c.status)!.count += c.scaffolds;
      figures.inspectionsDueToday += c.dueToday;
      figures.inspectionsOverdue += c.overdue;
    }
    for (const c of conflicts) {
      const figures = perSite.get(c.siteId);
      if (figures) figures.openConflicts += c.count;
    }

    const totals = emptyFigures();
    for (const figures of perSite.values()) add(totals, figures);
    return {
      generatedAt: new Date().toISOString(),
      siteId: query.siteId ?? null,
      totals,
      sites: sites.map((s) => ({ siteId: s.id, siteName: s.name, ...perSite.get(s.id)! })),
    };
  }
}
