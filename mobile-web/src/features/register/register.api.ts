import {
  type RegisterDueList,
  RegisterDueListSchema,
  type ScaffoldTriggerCreate,
  type ScaffoldTriggerResult,
  ScaffoldTriggerResultSchema,
} from '@plummet/shared';
import { authorisedFetch } from '../../api/authorised-fetch';

/** `GET /api/register/due`: scaffolds waiting on a trigger, never inspected, overdue or due today. */
export async function fetchDueList(siteId?: string): Promise<RegisterDueList> {
  const query = siteId ? `?${new URLSearchParams({ siteId }).toString()}` : '';
  return RegisterDueListSchema.parse(await authorisedFetch(`/register/due${query}`));
}

/** `POST /api/scaffolds/:id/trigger`: closes the scaffold and makes its inspection due now. */
export async function postTrigger(scaffoldId: string, body: ScaffoldTriggerCreate): Promise<ScaffoldTriggerResult> {
  return ScaffoldTriggerResultSchema.parse(await authorisedFetch(`/scaffolds/${scaffoldId}/trigger`, { method: 'POST', body }));
}
