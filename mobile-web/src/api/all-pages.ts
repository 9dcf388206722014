import { LIMITS } from '@plummet/shared';
import { authorisedFetch } from './authorised-fetch';

/**
 * A shared list schema (`{ items, nextCursor }`). Only its runtime check is used here: zod's
 * inferred output and the exported item type can differ in optional-key detail, so the caller
 * names the item type.
 */
interface ListSchema {
  parse(value: unknown): unknown;
}

/** Safety stop: 200 pages of 200 is far beyond any site, and a server bug must not loop forever. */
const MAX_PAGES = 200;

/**
 * Follows a keyset-paginated list to its end (shared/src/common/list.schema.ts), parsing every
 * page with the list's shared schema.
 */
export async function fetchAllPages<T>(path: string, query: Record<string, string>, schema: ListSchema, signal?: AbortSignal): Promise<T[]> {
  const items: T[] = [];
  let cursor: string | null = null;
  for (let page = 0; page < MAX_PAGES; page++) {
    const params = new URLSearchParams({ ...query, limit: String(LIMITS.listLimitMax) });
    if (cursor) params.set('cursor', cursor);
    const body = schema.parse(await authorisedFetch<unknown>(`${path}?${params.toString()}`, { signal })) as { items: T[]; nextCursor: string | null };
    items.push(...body.items);
    cursor = body.nextCursor;
    if (!cursor) return items;
  }
  throw new Error(`The list at ${path} did not end after ${MAX_PAGES} pages.`);
}
