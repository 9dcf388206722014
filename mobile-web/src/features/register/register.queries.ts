import { useQuery } from '@tanstack/react-query';
import { useLiveQuery } from 'dexie-react-hooks';
import { useEffect, useState } from 'react';
import { db } from '../../local-db/db';
import { useOnlineStatus } from '../../lib/use-online-status';
import { fetchDueList } from './register.api';
import { localDueItems } from './local-due';

export const registerKeys = {
  all: ['register'] as const,
  due: (siteId?: string) => [...registerKeys.all, 'due', siteId ?? 'organisation'] as const,
};

/**
 * The due list: the server's (every site, with triggers) when online; worked out from the sites
 * and scaffolds on this phone when not.
 */
export function useDueList(siteId?: string) {
  const online = useOnlineStatus();
  const server = useQuery({ queryKey: registerKeys.due(siteId), queryFn: () => fetchDueList(siteId), enabled: online, networkMode: 'online', refetchInterval: 60_000 });
  // The phone's own list is worked out when it is to be shown: offline, when the server's answer
  // failed, or once a start has waited as long as the home waits for it (ShowWhenSettled's 3 s).
  // Online, the server's answer usually comes first, and reading every scaffold and working out
  // their due times (the time-zone data it loads) would be a start's work for nothing. Once worked
  // out it stays live, so going offline later shows it at once.
  const late = useTimePassed(LOCAL_DUE_LIST_AFTER_MS);
  const wanted = useStickyTrue(!online || server.isError || late);
  const local = useLiveQuery(
    async () => (wanted ? localDueItems(await db.scaffolds.toArray(), await db.sites.toArray(), new Date()) : undefined),
    [wanted],
  );
  const fromServer = online && server.data !== undefined;
  // The first answer is in: the server's (or its failure) when online, the phone's otherwise.
  const settled = online ? server.isFetched || server.isError : local !== undefined;
  return { items: fromServer ? server.data!.items : local, fromServer, failed: online && server.isError, settled };
}

/** How long an online start leaves the phone's own due list unread while the server's is on its way. */
const LOCAL_DUE_LIST_AFTER_MS = 3000;

/** False until `ms` after the first render, then true. */
function useTimePassed(ms: number): boolean {
  const [passed, setPassed] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setPassed(true), ms);
    return () => clearTimeout(timer);
  }, [ms]);
  return passed;
}

/** True from the first render at which `value` is true, and from then on. */
function useStickyTrue(value: boolean): boolean {
  const [seen, setSeen] = useState(value);
  if (value && !seen) setSeen(true);
  return seen || value;
}
