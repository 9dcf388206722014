import type { CatalogueItem } from '@plummet/shared';
import type { CatalogueItemRecord } from '../../local-db/records';

/** Lower-case words of an item's name, for the prefix index (`*words`). */
export function wordsOf(name: string): string[] {
  return [...new Set(name.toLowerCase().split(/[^\p{L}\p{N}]+/u).filter((word) => word.length > 0))];
}

export function catalogueRecordOf(item: CatalogueItem): CatalogueItemRecord {
  return { ...item, words: wordsOf(item.name) };
}

/**
 * Items whose words start with every word typed, in any order ("coup dou" finds "Double
 * coupler"); best first: a name that starts with the query, then by name.
 */
export function searchCatalogue<T extends Pick<CatalogueItemRecord, 'name' | 'words'>>(items: readonly T[], query: string, limit = 8): T[] {
  const typed = wordsOf(query);
  if (typed.length === 0) return [];
  const hits = items.filter((item) => typed.every((word) => item.words.some((w) => w.startsWith(word))));
  const q = query.trim().toLowerCase();
  return hits
    .sort((a, b) => Number(b.name.toLowerCase().startsWith(q)) - Number(a.name.toLowerCase().startsWith(q)) || a.name.localeCompare(b.name))
    .slice(0, limit);
}
