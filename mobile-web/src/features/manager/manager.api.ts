import {
  FindingHistorySchema,
  FindingListResponseSchema,
  FindingSchema,
  InspectionSchema,
  MailJobListResponseSchema,
  type MailJob,
  type Inspection,
  PeopleSchema,
  OverviewSchema,
  PhotoListSchema,
  ReportSendResponseSchema,
  type Photo,
  ScaffoldListResponseSchema,
  ScaffoldReportsSchema,
  SiteListResponseSchema,
  SyncConflictListResponseSchema,
  TrendsSchema,
  type Finding,
  type FindingListItem,
  type ListResponse,
  type Person,
  type Overview,
  type Scaffold,
  type ScaffoldReports,
  type Site,
  type SyncConflict,
  type Trends,
} from '@plummet/shared';
import { fetchAllPages } from '../../api/all-pages';
import { authorisedFetch, fetchWithAccessToken } from '../../api/authorised-fetch';
import { ApiError } from '../../api/http';
import type { z } from 'zod';
import { filtersToParams, type FindingFilters } from './finding-filters';

export type FindingHistory = z.infer<typeof FindingHistorySchema>;

const withQuery = (path: string, params: URLSearchParams) => (params.size ? `${path}?${params.toString()}` : path);

export async function fetchOverview(siteId?: string): Promise<Overview> {
  return OverviewSchema.parse(await authorisedFetch(withQuery('/overview', new URLSearchParams(siteId ? { siteId } : {}))));
}

export async function fetchTrends(siteId: string | undefined, weeks: number): Promise<Trends> {
  const params = new URLSearchParams({ weeks: String(weeks), ...(siteId ? { siteId } : {}) });
  return TrendsSchema.parse(await authorisedFetch(withQuery('/trends', params)));
}

export async function fetchFindingsPage(filters: FindingFilters, cursor?: string): Promise<ListResponse<FindingListItem>> {
  const params = filtersToParams(filters);
  params.set('limit', '50');
  if (cursor) params.set('cursor', cursor);
  return FindingListResponseSchema.parse(await authorisedFetch(withQuery('/findings', params))) as ListResponse<FindingListItem>;
}

export async function fetchFinding(id: string): Promise<Finding> {
  return FindingSchema.parse(await authorisedFetch(`/findings/${id}`));
}

/** The history route comes with the fix loop; until the server has it, a 404 means "no history yet". */
export async function fetchFindingHistory(id: string): Promise<FindingHistory | null> {
  try {
    return FindingHistorySchema.parse(await authorisedFetch(`/findings/${id}/history`));
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
}

export async function fetchFindingConflicts(id: string): Promise<SyncConflict[]> {
  return SyncConflictListResponseSchema.parse(await authorisedFetch(`/sync/conflicts?status=open&entityId=${id}`)).items;
}

export const fetchSites = () => fetchAllPages<Site>('/sites', {}, SiteListResponseSchema);
export const fetchScaffolds = () => fetchAllPages<Scaffold>('/scaffolds', {}, ScaffoldListResponseSchema);
export const fetchMembers = async (): Promise<Person[]> => PeopleSchema.parse(await authorisedFetch('/overview/people')).items;

export async function fetchScaffoldReports(scaffoldId: string): Promise<ScaffoldReports> {
  return ScaffoldReportsSchema.parse(await authorisedFetch(`/reports/scaffold?scaffoldId=${scaffoldId}`));
}

export async function assignFinding(id: string, assigneeId: string | null, dueAt: string | null): Promise<Finding> {
  return FindingSchema.parse(await authorisedFetch(`/findings/${id}/assign`, { method: 'POST', body: { assigneeId, dueAt } }));
}

export async function reopenFinding(id: string, note: string): Promise<Finding> {
  return FindingSchema.parse(await authorisedFetch(`/findings/${id}/state`, { method: 'POST', body: { to: 'open', note } }));
}

export async function settleConflict(id: string, keep: 'current' | 'replaced'): Promise<void> {
  await authorisedFetch(`/sync/conflicts/${id}/resolve`, { method: 'POST', body: { keep } });
}

/** The export as a file the browser saves: fetched with the access token, then handed to a download link. */
export async function downloadFindingsCsv(filters: FindingFilters): Promise<void> {
  const params = filtersToParams(filters);
  const response = await fetchWithAccessToken()(`/api${withQuery('/findings/export.csv', params)}`);
  if (!response.ok) throw new ApiError(response.status, 'EXPORT_FAILED', 'The export could not be made; try again.');
  const blob = await response.blob();
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = `findings-${new Date().toISOString().slice(0, 10)}.csv`;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** A photo's thumbnail as an object URL (photos need the access token, so a plain <img src> cannot load them). */
export async function fetchPhotoThumbnail(photoId: string): Promise<string> {
  const response = await fetchWithAccessToken()(`/api/photos/${photoId}/thumbnail`);
  if (!response.ok) throw new ApiError(response.status, 'PHOTO_FAILED', 'The photo could not be loaded.');
  return URL.createObjectURL(await response.blob());
}

export async function fetchFindingPhotos(findingId: string): Promise<Photo[]> {
  return PhotoListSchema.parse(await authorisedFetch(`/photos?ownerType=finding&ownerId=${findingId}`)).items;
}

export type ReportOpening = { kind: 'pdf' } | { kind: 'record'; record: Inspection };

/**
 * Opens an inspection's PDF report in a new tab; where the server has no report route yet (404),
 * answers the inspection's own record for the screen to show instead.
 */
export async function openInspectionReport(inspectionId: string): Promise<ReportOpening> {
  const response = await fetchWithAccessToken()(`/api/inspections/${inspectionId}/report.pdf`);
  if (response.status === 404) {
    return { kind: 'record', record: InspectionSchema.parse(await authorisedFetch(`/inspections/${inspectionId}`)) };
  }
  if (!response.ok) throw new ApiError(response.status, 'REPORT_FAILED', 'The report could not be opened; try again.');
  const url = URL.createObjectURL(await response.blob());
  window.open(url, '_blank', 'noopener');
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
  return { kind: 'pdf' };
}

/** Downloads an inspection's PDF report: the route needs the bearer token, so it is fetched and saved from a blob. */
export async function downloadInspectionReport(inspectionId: string, fileName: string): Promise<void> {
  const response = await fetchWithAccessToken()(`/api/inspections/${inspectionId}/report.pdf`);
  if (!response.ok) throw new ApiError(response.status, 'REPORT_FAILED', 'The PDF could not be downloaded; try again.');
  const url = URL.createObjectURL(await response.blob());
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Queues the report e-mail again to the site's managers; answers the queued job's id. */
export async function sendInspectionReportAgain(inspectionId: string): Promise<string> {
  return ReportSendResponseSchema.parse(await authorisedFetch(`/inspections/${inspectionId}/report/send`, { method: 'POST' })).jobId;
}

/** The organisation's e-mails that failed after every retry (admins only). */
export async function fetchFailedMailJobs(): Promise<MailJob[]> {
  return MailJobListResponseSchema.parse(await authorisedFetch('/mail-jobs/failed')).items;
}

/** Puts a failed e-mail back in the queue; the server's workers send it in a few seconds. */
export async function retryMailJob(id: string): Promise<void> {
  await authorisedFetch(`/mail-jobs/${id}/retry`, { method: 'POST' });
}
