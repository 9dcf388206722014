import { sql } from 'drizzle-orm';
import type { DbExecutor } from '../db/db.tokens.js';
import { syncConflicts } from '../db/schema/index.js';

export type ConflictInsert = typeof syncConflicts.$inferInsert;

/**
 * The two writes every command layer (findings, inspections, scaffolds, user settings) shares,
 * inside the command's transaction: the clashes it keeps (rows built by `conflictRows` in
 * command-actor.ts), and the transaction's clock, which stamps each field it writes.
 */
export async function insertConflictRows(executor: DbExecutor, rows: ConflictInsert[]): Promise<{ id: string; field: string }[]> {
  return rows.length ? executor.insert(syncConflicts).values(rows).returning({ id: syncConflicts.id, field: syncConflicts.field }) : [];
}

/** `now()` of the transaction: the same instant for every write of one command. */
export async function transactionNow(executor: DbExecutor): Promise<Date> {
  const result = await executor.execute<{ now: string | Date }>(sql`select now() as now`);
  const value = result.rows[0]!.now;
  return value instanceof Date ? value : new Date(value);
}
