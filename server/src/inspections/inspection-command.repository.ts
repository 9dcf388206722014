import { Inject, Injectable } from '@nestjs/common';
import { and, eq, sql } from 'drizzle-orm';
import type { Control } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { controlChecks } from '../db/schema/index.js';
import type { ControlCheckRow } from './inspection.mapper.js';

export type ControlCheckInsert = Omit<typeof controlChecks.$inferInsert, 'createdAt' | 'updatedAt' | 'version' | 'syncXid' | 'syncSeq'>;

/** The writes of the inspection commands (inspection-commands.ts) that the listing repository does not have. */
@Injectable()
export class InspectionCommandRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** The check answering `control` in the inspection, locked until the transaction ends. */
  async lockControlCheck(inspectionId: string, control: Control, executor: DbExecutor = this.db): Promise<ControlCheckRow | undefined> {
    const [row] = await executor
      .select()
      .from(controlChecks)
      .where(and(eq(controlChecks.inspectionId, inspectionId), eq(controlChecks.control, control)))
      .for('update');
    return row;
  }

  async findControlCheck(organisationId: string, id: string, executor: DbExecutor = this.db): Promise<ControlCheckRow | undefined> {
    const [row] = await executor
      .select()
      .from(controlChecks)
      .where(and(eq(controlChecks.id, id), eq(controlChecks.organisationId, organisationId)));
    return row;
  }

  /** Undefined when the (inspection, control) pair or the id is taken meanwhile. */
  async insertControlCheck(values: ControlCheckInsert, executor: DbExecutor = this.db): Promise<ControlCheckRow | undefined> {
    const [row] = await executor.insert(controlChecks).values(values).onConflictDoNothing().returning();
    return row;
  }

  async updateControlCheck(id: string, changes: Partial<Pick<ControlCheckInsert, 'result' | 'note' | 'syncFields'>>, executor: DbExecutor = this.db): Promise<ControlCheckRow> {
    const [row] = await executor
      .update(controlChecks)
      .set({ ...changes, version: sql`${controlChecks.version} + 1`, updatedAt: sql`now()` })
      .where(eq(controlChecks.id, id))
      .returning();
    return row!;
  }
}
