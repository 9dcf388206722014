import { type SQL, sql } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import type { DbExecutor } from '../../db/db.tokens.js';

/**
 * pg-boss's `db` option bound to an open Drizzle transaction: the job row is written by the same
 * transaction as the record that caused it, so both commit or neither does. pg-boss hands over
 * numbered-parameter SQL (`$1`, `$2`…); each number becomes a bound Drizzle parameter.
 */
export function transactionDb(tx: DbExecutor): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[] = []) {
      const parts = text.split(/\$(\d+)/);
      const chunks: SQL[] = parts.map((part, i) => (i % 2 === 1 ? sql`${sql.param(values[Number(part) - 1])}` : sql.raw(part)));
      const result = await tx.execute(sql.join(chunks, sql.raw('')));
      return { rows: result.rows as unknown[] as object[] };
    },
  };
}
