/**
 * One style for every list of the API: keyset pagination.
 *
 * Query: `limit` (1–200, default 50), `sort` (a column from the list's whitelist), `order`
 * (asc|desc) and `cursor` (opaque, from the previous page's `nextCursor`; it only fits the same
 * sort and order). Answer: `{ items, nextCursor }`; `nextCursor` is null on the last page. No total
 * is counted: a count over 100,000 findings per page would cost more than the page itself.
 */
import { z } from 'zod';
import { LIMITS } from './fields.schema.js';

export const SortOrderSchema = z.enum(['asc', 'desc']);
export type SortOrder = z.infer<typeof SortOrderSchema>;

/** The query fields every list accepts, with the list's own sort whitelist and default. */
export function listQueryShape<const S extends readonly [string, ...string[]]>(sorts: S, defaultSort: S[number], defaultOrder: SortOrder) {
  return {
    limit: z.coerce.number().int().min(1).max(LIMITS.listLimitMax).default(LIMITS.listLimitDefault),
    cursor: z.string().min(1).max(1000).optional(),
    sort: z.enum(sorts).default(defaultSort as never),
    order: SortOrderSchema.default(defaultOrder),
  };
}

/** The generic list query (used where a list has only the default sort). */
export const ListQuerySchema = z.object(listQueryShape(['createdAt'], 'createdAt', 'desc'));
export type ListQuery = z.infer<typeof ListQuerySchema>;

/** `{ items, nextCursor }` around any item schema. */
export function listResponseSchema<T extends z.ZodType>(item: T) {
  return z.object({ items: z.array(item), nextCursor: z.string().nullable() });
}

export interface ListResponse<T> {
  items: T[];
  /** Pass as `cursor` to get the next page; null on the last page. */
  nextCursor: string | null;
}

/** A query flag: `true`/`false` (also 1/0, yes/no). */
export const QueryBooleanSchema = z.stringbool();

/** A query filter that may repeat (`state=open&state=fixed`) or be comma-separated (`state=open,fixed`). */
export function queryList<T extends z.ZodType>(item: T) {
  return z.preprocess(
    (v) => (typeof v === 'string' ? v.split(',').filter((s) => s !== '') : v),
    z.array(item).min(1).max(20),
  );
}
