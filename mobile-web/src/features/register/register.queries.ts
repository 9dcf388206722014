import { useQuery } from '@tanstack/react-query';
import { useLiveQuery } from 'dexie-react-hooks';
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
  const local = useLiveQuery(async () => localDueItems(await db.scaffolds.toArray(), await db.sites.toArray(), new Date()), []);
  const fromServer = online && server.data !== undefined;
  // The first answer is in: the server's (or its failure) when online, the phone's otherwise.
  const settled = online ? server.isFetched || server.isError : local !== undefined;
  return { items: fromServer ? server.data!.items : local, fromServer, failed: online && server.isError, settled };
}
