import { FindingFullListResponseSchema, UNFIXED_STATES, type Finding } from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';

/**
 * `GET /api/findings?siteId=&state=open,made-safe&estimate=full`: the findings of a site that still
 * need a fix, each whole (the phone keeps them to open and edit on the walk; list rows would not do).
 */
export function fetchOpenFindingsOfSite(siteId: string, signal?: AbortSignal): Promise<Finding[]> {
  return fetchAllPages<Finding>('/findings', { siteId, state: UNFIXED_STATES.join(','), estimate: 'full' }, FindingFullListResponseSchema, signal);
}
