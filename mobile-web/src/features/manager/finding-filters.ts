import type { FindingListQuery } from '@plummet/shared';

/** The table's filters and sort, as they sit in the page's URL (so a number on the overview can open them). */
export interface FindingFilters {
  siteId?: string;
  scaffoldId?: string;
  riskBand?: string[];
  state?: string[];
  assigneeId?: string;
  overdue?: boolean;
  /** YYYY-MM-DD, inclusive, in the viewer's time zone. */
  raisedFrom?: string;
  /** YYYY-MM-DD, inclusive. */
  raisedTo?: string;
  q?: string;
  sort: FindingListQuery['sort'];
  order: 'asc' | 'desc';
}

export const SORTABLE: FindingListQuery['sort'][] = ['riskScore', 'dueAt', 'createdAt', 'updatedAt', 'heightM'];

const list = (value: string | null) => (value ? value.split(',').filter(Boolean) : undefined);

export function filtersFromSearch(search: URLSearchParams): FindingFilters {
  const sort = search.get('sort') as FindingListQuery['sort'] | null;
  const overdue = search.get('overdue');
  return {
    siteId: search.get('siteId') ?? undefined,
    scaffoldId: search.get('scaffoldId') ?? undefined,
    riskBand: list(search.get('riskBand')),
    state: list(search.get('state')),
    assigneeId: search.get('assigneeId') ?? undefined,
    overdue: overdue === 'true' ? true : overdue === 'false' ? false : undefined,
    raisedFrom: search.get('raisedFrom') ?? undefined,
    raisedTo: search.get('raisedTo') ?? undefined,
    q: search.get('q') ?? undefined,
    sort: sort && SORTABLE.includes(sort) ? sort : 'riskScore',
    order: search.get('order') === 'asc' ? 'asc' : 'desc',
  };
}

/** The page URL's search: only what differs from the defaults. */
export function filtersToSearch(filters: FindingFilters): URLSearchParams {
  const params = new URLSearchParams();
  for (const key of ['siteId', 'scaffoldId', 'assigneeId', 'raisedFrom', 'raisedTo', 'q'] as const) {
    const value = filters[key];
    if (value) params.set(key, value);
  }
  if (filters.riskBand?.length) params.set('riskBand', filters.riskBand.join(','));
  if (filters.state?.length) params.set('state', filters.state.join(','));
  if (filters.overdue !== undefined) params.set('overdue', String(filters.overdue));
  if (filters.sort !== 'riskScore') params.set('sort', filters.sort);
  if (filters.order !== 'desc') params.set('order', filters.order);
  return params;
}

/** Local midnight of a YYYY-MM-DD day as an ISO instant. */
function dayStart(day: string, plusDays = 0): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Date(y, m - 1, d + plusDays).toISOString();
}

/** The API's query: dates become instants ("to" includes the whole day), sort and order always sent. */
export function filtersToParams(filters: FindingFilters): URLSearchParams {
  const params = filtersToSearch(filters);
  params.set('sort', filters.sort);
  params.set('order', filters.order);
  if (filters.raisedFrom) params.set('raisedFrom', dayStart(filters.raisedFrom));
  if (filters.raisedTo) params.set('raisedTo', dayStart(filters.raisedTo, 1));
  return params;
}
