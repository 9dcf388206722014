import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, inArray } from 'drizzle-orm';
import { readOrganisationSettings } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { controlChecks, findings, inspections, memberships, organisations, photos, scaffolds, siteManagers, sites, users } from '../db/schema/index.js';
import type { ReportData, ReportPerson } from './report-data.js';

/** Everything a report or its e-mail shows, read in one place (the only Drizzle of the reports feature). */
@Injectable()
export class ReportDataRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** The inspection with its site, scaffold, checks, findings and photos; undefined outside the organisation. */
  async load(inspectionId: string, organisationId?: string, executor: DbExecutor = this.db): Promise<ReportData | undefined> {
    const where = organisationId
      ? and(eq(inspections.id, inspectionId), eq(inspections.organisationId, organisationId))
      : eq(inspections.id, inspectionId);
    const [head] = await executor
      .select({ inspection: inspections, scaffold: scaffolds, site: sites, organisation: organisations, inspector: users })
      .from(inspections)
      .innerJoin(scaffolds, eq(scaffolds.id, inspections.scaffoldId))
      .innerJoin(sites, eq(sites.id, scaffolds.siteId))
      .innerJoin(organisations, eq(organisations.id, inspections.organisationId))
      .innerJoin(users, eq(users.id, inspections.inspectorId))
      .where(where);
    if (!head) return undefined;
    const checks = await executor.select().from(controlChecks).where(eq(controlChecks.inspectionId, inspectionId)).orderBy(asc(controlChecks.control));
    const rows = await executor.select().from(findings).where(eq(findings.inspectionId, inspectionId));
    const assigneeIds = [...new Set(rows.map((f) => f.assigneeId).filter((id): id is string => id !== null))];
    const assignees = assigneeIds.length ? await executor.select().from(users).where(inArray(users.id, assigneeIds)) : [];
    const photoRows = rows.length
      ? await executor
          .select()
          .from(photos)
          .where(and(eq(photos.ownerType, 'finding'), inArray(photos.ownerId, rows.map((f) => f.id))))
          .orderBy(asc(photos.createdAt))
      : [];
    const person = (u: typeof users.$inferSelect): ReportPerson => ({ id: u.id, name: u.name, email: u.email, position: u.position });
    const byId = new Map(assignees.map((u) => [u.id, person(u)]));
    return {
      inspection: head.inspection,
      scaffold: head.scaffold,
      site: head.site,
      organisation: { id: head.organisation.id, name: head.organisation.name, settings: readOrganisationSettings(head.organisation.settings) },
      inspector: person(head.inspector),
      controlChecks: checks,
      findings: rows.map((f) => ({
        row: f,
        assignee: f.assigneeId ? (byId.get(f.assigneeId) ?? null) : null,
        photos: photoRows.filter((p) => p.ownerId === f.id),
      })),
    };
  }

  /** The site's own managers, or every active manager of the organisation when it has none. */
  async managersFor(organisationId: string, siteId: string, executor: DbExecutor = this.db): Promise<ReportPerson[]> {
    const managerOf = and(eq(memberships.organisationId, organisationId), eq(memberships.role, 'manager'), eq(users.active, true));
    const own = await executor
      .select({ user: users })
      .from(siteManagers)
      .innerJoin(users, eq(users.id, siteManagers.userId))
      .innerJoin(memberships, eq(memberships.userId, users.id))
      .where(and(eq(siteManagers.siteId, siteId), managerOf));
    const chosen = own.length
      ? own
      : await executor.select({ user: users }).from(users).innerJoin(memberships, eq(memberships.userId, users.id)).where(managerOf);
    return chosen.map(({ user: u }) => ({ id: u.id, name: u.name, email: u.email, position: u.position }));
  }

  async user(id: string, executor: DbExecutor = this.db): Promise<ReportPerson | undefined> {
    const [u] = await executor.select().from(users).where(eq(users.id, id));
    return u ? { id: u.id, name: u.name, email: u.email, position: u.position } : undefined;
  }

  /** A finding with its scaffold, site and organisation (for the assignment e-mail). */
  async finding(id: string, executor: DbExecutor = this.db) {
    const [row] = await executor
      .select({ finding: findings, scaffold: scaffolds, site: sites, organisation: organisations })
      .from(findings)
      .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
      .innerJoin(sites, eq(sites.id, scaffolds.siteId))
      .innerJoin(organisations, eq(organisations.id, findings.organisationId))
      .where(eq(findings.id, id));
    return row;
  }
}
