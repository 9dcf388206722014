import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, inArray, isNull, lte, type SQL, sql } from 'drizzle-orm';
import type { FieldStamps, InspectionRegime, ScaffoldStatus, ScaffoldTriggerKind } from '@plummet/shared';
import { scaffoldInScope } from '../common/foreman-scope.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { scaffolds, scaffoldTriggers, sites } from '../db/schema/index.js';

export type ScaffoldTriggerRow = typeof scaffoldTriggers.$inferSelect;

/** A scaffold that may be on the due list, with its site and the oldest trigger still waiting. */
export interface DueCandidate {
  scaffold: typeof scaffolds.$inferSelect;
  site: { id: string; name: string; regime: InspectionRegime; timeZone: string };
  trigger: { kind: ScaffoldTriggerKind; note: string; recordedAt: Date } | null;
}

@Injectable()
export class RegisterRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async insertTrigger(
    values: { organisationId: string; scaffoldId: string; kind: ScaffoldTriggerKind; note: string; recordedBy: string; recordedAt: Date },
    executor: DbExecutor = this.db,
  ): Promise<ScaffoldTriggerRow> {
    const [row] = await executor.insert(scaffoldTriggers).values(values).returning();
    return row;
  }

  /** Closes the scaffold and makes its inspection due (an alteration also stamps when it was altered). */
  async closeForTrigger(
    scaffoldId: string,
    changes: { status?: ScaffoldStatus; syncFields?: FieldStamps; nextDueAt: Date; alteredAt?: Date },
    executor: DbExecutor = this.db,
  ): Promise<typeof scaffolds.$inferSelect> {
    const [row] = await executor
      .update(scaffolds)
      .set({ ...changes, version: sql`${scaffolds.version} + 1`, updatedAt: sql`now()` })
      .where(eq(scaffolds.id, scaffoldId))
      .returning();
    return row;
  }

  /** The signed inspection answers every trigger of its scaffold recorded before it finished. */
  async answerTriggers(scaffoldId: string, inspectionId: string, finishedAt: Date, executor: DbExecutor = this.db): Promise<ScaffoldTriggerRow[]> {
    return executor
      .update(scaffoldTriggers)
      .set({ answeredBy: inspectionId })
      .where(and(eq(scaffoldTriggers.scaffoldId, scaffoldId), isNull(scaffoldTriggers.answeredBy), lte(scaffoldTriggers.recordedAt, finishedAt)))
      .returning();
  }

  /**
   * Scaffolds not archived whose inspection is due within two days, never inspected, or waiting on a
   * trigger; the service keeps those the shared rule puts on the list (today in each site's zone).
   */
  async dueCandidates(organisationId: string, siteId: string | undefined, foremanId: string | undefined, executor: DbExecutor = this.db): Promise<DueCandidate[]> {
    const waiting = sql`exists (select 1 from ${scaffoldTriggers} t where t.scaffold_id = ${scaffolds.id} and t.answered_by is null)`;
    const where: (SQL | undefined)[] = [
      eq(scaffolds.organisationId, organisationId),
      isNull(scaffolds.archivedAt),
      sql`(${scaffolds.nextDueAt} is null or ${scaffolds.nextDueAt} < now() + interval '2 days' or ${waiting})`,
    ];
    if (siteId) where.push(eq(scaffolds.siteId, siteId));
    if (foremanId) where.push(scaffoldInScope(scaffolds.id, foremanId));
    const rows = await executor
      .select({ scaffold: scaffolds, site: { id: sites.id, name: sites.name, regime: sites.regime, timeZone: sites.timeZone } })
      .from(scaffolds)
      .innerJoin(sites, eq(sites.id, scaffolds.siteId))
      .where(and(...where))
      .orderBy(asc(sites.name), asc(scaffolds.reference));
    const triggers = rows.length
      ? await executor
          .select()
          .from(scaffoldTriggers)
          .where(and(inArray(scaffoldTriggers.scaffoldId, rows.map((r) => r.scaffold.id)), isNull(scaffoldTriggers.answeredBy)))
          .orderBy(asc(scaffoldTriggers.recordedAt))
      : [];
    const oldest = new Map<string, ScaffoldTriggerRow>();
    for (const t of triggers) if (!oldest.has(t.scaffoldId)) oldest.set(t.scaffoldId, t);
    return rows.map((r) => {
      const t = oldest.get(r.scaffold.id);
      return { ...r, trigger: t ? { kind: t.kind, note: t.note, recordedAt: t.recordedAt } : null };
    });
  }
}
