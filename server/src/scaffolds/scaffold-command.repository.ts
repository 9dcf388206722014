import { Inject, Injectable } from '@nestjs/common';
import { sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { syncConflicts } from '../db/schema/index.js';

export type ConflictInsert = typeof syncConflicts.$inferInsert;

/** The writes of the scaffold commands (scaffold-commands.ts) that the listing repository does not have. */
@Injectable()
export class ScaffoldCommandRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async insertConflicts(rows: ConflictInsert[], executor: DbExecutor = this.db): Promise<{ id: string; field: string }[]> {
    return rows.length ? executor.insert(syncConflicts).values(rows).returning({ id: syncConflicts.id, field: syncConflicts.field }) : [];
  }

  async now(executor: DbExecutor = this.db): Promise<Date> {
    const result = await executor.execute<{ now: string | Date }>(sql`select now() as now`);
    const value = result.rows[0]!.now;
    return value instanceof Date ? value : new Date(value);
  }
}
