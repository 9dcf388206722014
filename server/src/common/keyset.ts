/**
 * Keyset pagination for every list (see shared/src/common/list.schema.ts): ORDER BY the sort key
 * and the id, and start after the cursor's (key, id) with a row comparison that an index on
 * (organisation_id, key, id) can serve. The key is read back as text so timestamps keep their
 * microseconds and `infinity` survives the round trip.
 */
import { type AnyColumn, type SQL, sql } from 'drizzle-orm';
import { decodeCursor, encodeCursor, type ListResponse, type SortOrder } from '@plummet/shared';
import { AppError, ErrorCode } from './app-error.js';
import { castsCleanly } from './cursor-values.js';

export type SortCast = 'integer' | 'bigint' | 'real' | 'text' | 'timestamptz' | 'uuid';

export interface SortKey {
  /** A column, or an expression that is never null (e.g. coalesce(due_at, 'infinity')). */
  expr: AnyColumn | SQL;
  cast: SortCast;
}

export interface KeysetQuery {
  sort: string;
  order: SortOrder;
  limit: number;
  cursor?: string;
}

export interface Keyset {
  /** The condition "after the cursor", or undefined on the first page. */
  after: SQL | undefined;
  orderBy: SQL[];
  /** One more than the page, to know whether another page follows. */
  fetch: number;
  /** Select it as `sortKey` to build the next cursor. */
  sortKey: SQL<string>;
}

const CASTS: Record<SortCast, SQL> = {
  integer: sql.raw('integer'),
  bigint: sql.raw('bigint'),
  uuid: sql.raw('uuid'),
  real: sql.raw('real'),
  text: sql.raw('text'),
  timestamptz: sql.raw('timestamptz'),
};

/** `idCast` is the type of the tie-breaking id column (uuid for every table but audit events). */
export function keyset(key: SortKey, id: AnyColumn, query: KeysetQuery, idCast: SortCast = 'uuid'): Keyset {
  const direction = sql.raw(query.order === 'asc' ? 'asc' : 'desc');
  let after: SQL | undefined;
  if (query.cursor !== undefined) {
    const position = decodeCursor(query.cursor, query.sort, query.order);
    if (!position || typeof position.value !== 'string' || !castsCleanly(position.value, key.cast) || !castsCleanly(position.id, idCast)) {
      throw new AppError(ErrorCode.ValidationFailed, 'The cursor is not one this list gave out; start again from the first page', [
        { path: ['cursor'], code: 'invalid_cursor', message: 'Not a cursor of this list with this sort and order' },
      ]);
    }
    const op = sql.raw(query.order === 'asc' ? '>' : '<');
    after = sql`(${key.expr}, ${id}) ${op} (${position.value}::${CASTS[key.cast]}, ${position.id}::${CASTS[idCast]})`;
  }
  return {
    after,
    orderBy: [sql`${key.expr} ${direction}`, sql`${id} ${direction}`],
    fetch: query.limit + 1,
    sortKey: sql<string>`(${key.expr})::text`,
  };
}

/** The page of `rows` (fetched with `keyset().fetch`) and the cursor of the next one. */
export function toPage<Row extends { sortKey: string; id: string }, Item>(
  rows: Row[],
  query: KeysetQuery,
  map: (row: Row) => Item,
): ListResponse<Item> {
  const more = rows.length > query.limit;
  const page = more ? rows.slice(0, query.limit) : rows;
  const last = page[page.length - 1];
  return {
    items: page.map(map),
    nextCursor: more && last ? encodeCursor({ sort: query.sort, order: query.order, value: last.sortKey, id: last.id }) : null,
  };
}
