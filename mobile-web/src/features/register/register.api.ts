import {
  type InspectionDetail,
  InspectionDetailSchema,
  InspectionListResponseSchema,
  type RegisterDueItem,
  RegisterDueItemSchema,
  type RegisterDueList,
  RegisterDueListSchema,
  type ScaffoldTriggerCreate,
  type ScaffoldTriggerResult,
  ScaffoldTriggerResultSchema,
} from '@plummet/shared';
import { authorisedFetch } from '../../api/authorised-fetch';
import { nextTask } from '../../lib/next-task';

/** `GET /api/register/due`: scaffolds waiting on a trigger, never inspected, overdue or due today. */
export async function fetchDueList(siteId?: string): Promise<RegisterDueList> {
  const query = siteId ? `?${new URLSearchParams({ siteId }).toString()}` : '';
  return parseDueList(await authorisedFetch(`/register/due${query}`));
}

/** How long the due list's check may hold the phone before it lets it paint and answer a tap. */
const PARSE_SLICE_MS = 8;

/**
 * RegisterDueListSchema.parse, an item at a time, with a pause for the browser every few
 * milliseconds: a long list checked in one go is a long task on a phone, on the home's busiest
 * moment. Anything that does not check gets the whole-list parse, so errors read as before.
 */
async function parseDueList(body: unknown): Promise<RegisterDueList> {
  const list = body as { items?: unknown } | null;
  if (typeof list !== 'object' || list === null || !Array.isArray(list.items)) return RegisterDueListSchema.parse(body);
  const items: RegisterDueItem[] = [];
  let sliceStart = performance.now();
  for (const item of list.items as unknown[]) {
    const checked = RegisterDueItemSchema.safeParse(item);
    if (!checked.success) return RegisterDueListSchema.parse(body);
    items.push(checked.data);
    if (performance.now() - sliceStart > PARSE_SLICE_MS) {
      await nextTask();
      sliceStart = performance.now();
    }
  }
  const envelope = RegisterDueListSchema.safeParse({ ...list, items: [] });
  if (!envelope.success) return RegisterDueListSchema.parse(body);
  return { ...envelope.data, items };
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
