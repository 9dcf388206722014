/** The React side of sync: the running engine and its status, for the screens (src/sync stays free of React). */
import { useEffect, useState, useSyncExternalStore } from 'react';
import { currentSyncEngine, subscribeRunningEngine } from '../../sync/running-engine';
import type { SyncEngine } from '../../sync/sync-engine';
import type { SyncStatus } from '../../sync/sync-status';

/** The running engine, or undefined while nobody is signed in. */
export function useAppSyncEngine(): SyncEngine | undefined {
  return useSyncExternalStore(subscribeRunningEngine, currentSyncEngine, () => undefined);
}

/** The engine's status, refreshed whenever it changes state (and every `refreshMs` for the pending count). */
export function useSyncStatus(engine: SyncEngine | undefined, refreshMs = 5000): SyncStatus | undefined {
  const [status, setStatus] = useState<SyncStatus>();
  useEffect(() => {
    if (!engine) return undefined;
    let live = true;
    const refresh = () => void engine.status().then((s) => live && setStatus(s));
    refresh();
    const unsubscribe = engine.subscribe(refresh);
    const timer = setInterval(refresh, refreshMs);
    return () => {
      live = false;
      unsubscribe();
      clearInterval(timer);
    };
  }, [engine, refreshMs]);
  return status;
}
