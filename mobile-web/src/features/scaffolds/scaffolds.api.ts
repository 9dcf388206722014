import { ScaffoldListResponseSchema, type Scaffold } from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';

/** `GET /api/scaffolds?siteId=`: the scaffolds of one site. */
export function fetchScaffoldsOfSite(siteId: string, signal?: AbortSignal): Promise<Scaffold[]> {
  return fetchAllPages<Scaffold>('/scaffolds', { siteId }, ScaffoldListResponseSchema, signal);
}
