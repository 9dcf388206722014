import { queryOptions, useInfiniteQuery, useQuery, type InfiniteData } from '@tanstack/react-query';
import type { FindingListItem, ListResponse } from '@plummet/shared';
import { useSession } from '../auth/session.queries';
import {
  fetchFailedMailJobs,
  fetchFinding,
  fetchFindingConflicts,
  fetchFindingHistory,
  fetchFindingPhotos,
  fetchFindingsPage,
  fetchMembers,
  fetchOverview,
  fetchScaffoldReports,
  fetchScaffolds,
  fetchSites,
  fetchTrends,
} from './manager.api';
import type { FindingFilters } from './finding-filters';
import { readLastLoaded, writeLastLoaded } from './last-loaded';

/** Key factory of every manager query: invalidate `managerKeys.all` after a manager action. */
export const managerKeys = {
  all: ['manager'] as const,
  overview: (siteId?: string) => [...managerKeys.all, 'overview', siteId ?? 'organisation'] as const,
  trends: (siteId: string | undefined, weeks: number) => [...managerKeys.all, 'trends', siteId ?? 'organisation', weeks] as const,
  // Rows without the estimate; a copy of the earlier whole findings, kept offline under 'findings', is left unread.
  findings: (filters: FindingFilters) => [...managerKeys.all, 'finding-rows', filters] as const,
  finding: (id: string) => [...managerKeys.all, 'finding', id] as const,
  history: (id: string) => [...managerKeys.all, 'finding', id, 'history'] as const,
  photos: (id: string) => [...managerKeys.all, 'finding', id, 'photos'] as const,
  conflicts: (id: string) => [...managerKeys.all, 'finding', id, 'conflicts'] as const,
  sites: () => [...managerKeys.all, 'sites'] as const,
  scaffolds: () => [...managerKeys.all, 'scaffolds'] as const,
  members: () => [...managerKeys.all, 'members'] as const,
  reports: (scaffoldId: string) => [...managerKeys.all, 'reports', scaffoldId] as const,
  failedMail: () => [...managerKeys.all, 'failed-mail'] as const,
};

/**
 * Online first: every answer is also kept as the last loaded copy, which is shown at once on the
 * next visit (and is all there is with no connection); `dataUpdatedAt` tells the stale note its age.
 */
function onlineFirst<T>(userId: string, queryKey: readonly unknown[], load: () => Promise<T>) {
  const last = () => readLastLoaded(userId, queryKey);
  return queryOptions({
    queryKey,
    queryFn: async () => {
      const data = await load();
      writeLastLoaded(userId, queryKey, data);
      return data;
    },
    initialData: () => last()?.data as T | undefined,
    initialDataUpdatedAt: () => last()?.at,
    enabled: userId !== '',
  });
}

const useUserId = () => useSession().session?.user.id ?? '';

export const useOverview = (siteId?: string) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.overview(siteId), () => fetchOverview(siteId)));
};

export const useTrends = (siteId: string | undefined, weeks: number) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.trends(siteId, weeks), () => fetchTrends(siteId, weeks)));
};

export const useSites = () => {
  const userId = useUserId();
  return useQuery({ ...onlineFirst(userId, managerKeys.sites(), fetchSites), staleTime: 5 * 60_000 });
};

export const useScaffolds = () => {
  const userId = useUserId();
  return useQuery({ ...onlineFirst(userId, managerKeys.scaffolds(), fetchScaffolds), staleTime: 5 * 60_000 });
};

export const useMembers = () => {
  const userId = useUserId();
  return useQuery({ ...onlineFirst(userId, managerKeys.members(), fetchMembers), staleTime: 5 * 60_000 });
};

export const useFinding = (id: string) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.finding(id), () => fetchFinding(id)));
};

export const useFindingHistory = (id: string) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.history(id), () => fetchFindingHistory(id)));
};

export const useFindingPhotos = (id: string) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.photos(id), () => fetchFindingPhotos(id)));
};

export const useFindingConflicts = (id: string) => {
  const userId = useUserId();
  return useQuery(onlineFirst(userId, managerKeys.conflicts(id), () => fetchFindingConflicts(id)));
};

export const useScaffoldReports = (scaffoldId: string | undefined) => {
  const userId = useUserId();
  return useQuery({
    ...onlineFirst(userId, managerKeys.reports(scaffoldId ?? ''), () => fetchScaffoldReports(scaffoldId!)),
    enabled: userId !== '' && scaffoldId !== undefined,
  });
};

type FindingsPages = InfiniteData<ListResponse<FindingListItem>, string | undefined>;

/** Keyset pages of the list route, "Show more" at a time; the first pages loaded are kept for offline reading. */
export function useFindingsTable(filters: FindingFilters) {
  const userId = useUserId();
  const queryKey = managerKeys.findings(filters);
  return useInfiniteQuery({
    queryKey,
    queryFn: async ({ pageParam }) => {
      const page = await fetchFindingsPage(filters, pageParam);
      if (!pageParam) writeLastLoaded(userId, queryKey, { pages: [page], pageParams: [undefined] } satisfies FindingsPages);
      return page;
    },
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    initialData: () => readLastLoaded(userId, queryKey)?.data as FindingsPages | undefined,
    initialDataUpdatedAt: () => readLastLoaded(userId, queryKey)?.at,
    enabled: userId !== '',
  });
}

/** Failed e-mails change as workers retry: always fetched fresh, never shown from an old copy. */
export const useFailedMailJobs = () => {
  const userId = useUserId();
  return useQuery({ queryKey: managerKeys.failedMail(), queryFn: fetchFailedMailJobs, enabled: userId !== '', refetchInterval: 15_000 });
};
