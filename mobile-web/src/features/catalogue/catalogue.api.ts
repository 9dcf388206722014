import { CatalogueListResponseSchema, type CatalogueItem } from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';

/** `GET /api/catalogue`: built-in items and the organisation's own. */
export function fetchCatalogue(signal?: AbortSignal): Promise<CatalogueItem[]> {
  return fetchAllPages<CatalogueItem>('/catalogue', {}, CatalogueListResponseSchema, signal);
}
