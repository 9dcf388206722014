import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, isNotNull, isNull, type SQL, sql } from 'drizzle-orm';
import type { Control, ControlCheckPut, InspectionListQuery } from '@plummet/shared';
import { scaffoldInScope } from '../common/foreman-scope.js';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { controlChecks, inspections, scaffolds } from '../db/schema/index.js';
import type { ControlCheckRow, InspectionRow } from './inspection.mapper.js';

const SORTS: Record<InspectionListQuery['sort'], SortKey> = {
  startedAt: { expr: inspections.startedAt, cast: 'timestamptz' },
  createdAt: { expr: inspections.createdAt, cast: 'timestamptz' },
  updatedAt: { expr: inspections.updatedAt, cast: 'timestamptz' },
};

export type InspectionInsert = Omit<typeof inspections.$inferInsert, 'createdAt' | 'updatedAt' | 'version'>;
export type InspectionChanges = Partial<Omit<InspectionInsert, 'id' | 'organisationId' | 'scaffoldId' | 'inspectorId'>>;

@Injectable()
export class InspectionsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** A page of the organisation's inspections; with `foremanId`, only those of that foreman's scaffolds. */
  async list(organisationId: string, query: InspectionListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    const page = keyset(SORTS[query.sort], inspections.id, query);
    const where: (SQL | undefined)[] = [eq(inspections.organisationId, organisationId), page.after];
    if (foremanId) where.push(scaffoldInScope(inspections.scaffoldId, foremanId));
    if (query.scaffoldId) where.push(eq(inspections.scaffoldId, query.scaffoldId));
    if (query.siteId) {
      where.push(
        sql`${inspections.scaffoldId} in (select ${scaffolds.id} from ${scaffolds} where ${scaffolds.siteId} = ${query.siteId} and ${scaffolds.organisationId} = ${organisationId})`,
      );
    }
    if (query.inspectorId) where.push(eq(inspections.inspectorId, query.inspectorId));
    if (query.finished === true) where.push(isNotNull(inspections.finishedAt));
    if (query.finished === false) where.push(isNull(inspections.finishedAt));
    return executor
      .select({ row: inspections, sortKey: page.sortKey })
      .from(inspections)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  /** By id in any organisation: a client id taken by another organisation must not be reused. */
  async findAnyOrg(id: string, executor: DbExecutor = this.db): Promise<InspectionRow | undefined> {
    const [row] = await executor.select().from(inspections).where(eq(inspections.id, id));
    return row;
  }

  async find(organisationId: string, id: string, executor: DbExecutor = this.db, forUpdate = false): Promise<InspectionRow | undefined> {
    const q = executor
      .select()
      .from(inspections)
      .where(and(eq(inspections.id, id), eq(inspections.organisationId, organisationId)));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row;
  }

  /** Inserts unless the id exists (a retry racing the first attempt); undefined when it did. */
  async insertIfAbsent(values: InspectionInsert, executor: DbExecutor = this.db): Promise<InspectionRow | undefined> {
    const [row] = await executor.insert(inspections).values(values).onConflictDoNothing({ target: inspections.id }).returning();
    return row;
  }

  async update(id: string, changes: InspectionChanges, executor: DbExecutor = this.db): Promise<InspectionRow> {
    const [row] = await executor
      .update(inspections)
      .set({ ...changes, version: sql`${inspections.version} + 1`, updatedAt: sql`now()` })
      .where(eq(inspections.id, id))
      .returning();
    return row;
  }

  async controlChecks(inspectionId: string, executor: DbExecutor = this.db): Promise<ControlCheckRow[]> {
    return executor.select().from(controlChecks).where(eq(controlChecks.inspectionId, inspectionId)).orderBy(asc(controlChecks.control));
  }

  async findControlCheck(inspectionId: string, control: Control, executor: DbExecutor = this.db): Promise<ControlCheckRow | undefined> {
    const [row] = await executor
      .select()
      .from(controlChecks)
      .where(and(eq(controlChecks.inspectionId, inspectionId), eq(controlChecks.control, control)));
    return row;
  }

  /** One row per (inspection, control): a second answer replaces the first and bumps its version. */
  async upsertControlCheck(
    organisationId: string,
    inspectionId: string,
    control: Control,
    input: ControlCheckPut,
    executor: DbExecutor = this.db,
  ): Promise<ControlCheckRow> {
    const [row] = await executor
      .insert(controlChecks)
      .values({ id: randomUUID(), organisationId, inspectionId, control, result: input.result, note: input.note })
      .onConflictDoUpdate({
        target: [controlChecks.inspectionId, controlChecks.control],
        set: { result: input.result, note: input.note, version: sql`${controlChecks.version} + 1`, updatedAt: sql`now()` },
      })
      .returning();
    return row;
  }
}
