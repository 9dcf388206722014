import { FindingListResponseSchema, UNFIXED_STATES, type Finding } from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';

/** `GET /api/findings?siteId=&state=open,made-safe`: the findings of a site that still need a fix. */
export function fetchOpenFindingsOfSite(siteId: string, signal?: AbortSignal): Promise<Finding[]> {
  return fetchAllPages<Finding>('/findings', { siteId, state: UNFIXED_STATES.join(',') }, FindingListResponseSchema, signal);
}
