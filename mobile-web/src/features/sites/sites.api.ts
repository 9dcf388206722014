import { SiteListResponseSchema, type Site } from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';

/** `GET /api/sites`: every site of the user's organisation, by name. */
export function fetchSites(signal?: AbortSignal): Promise<Site[]> {
  return fetchAllPages<Site>('/sites', { sort: 'name', order: 'asc' }, SiteListResponseSchema, signal);
}
