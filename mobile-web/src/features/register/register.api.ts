import {
  type InspectionDetail,
  InspectionDetailSchema,
  InspectionListResponseSchema,
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

/** The scaffold's latest signed inspection with its control checks, or null when none is signed yet. */
export async function fetchLastSignedReport(scaffoldId: string): Promise<InspectionDetail | null> {
  const params = new URLSearchParams({ scaffoldId, finished: 'true', sort: 'startedAt', order: 'desc', limit: '1' });
  const list = InspectionListResponseSchema.parse(await authorisedFetch(`/inspections?${params.toString()}`));
  const last = list.items[0];
  return last ? InspectionDetailSchema.parse(await authorisedFetch(`/inspections/${last.id}`)) : null;
}
