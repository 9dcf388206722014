/** What the app shows about sync: one small status store and its React hook (the only UI-facing part). */
import type { SyncConflict } from '@plummet/shared';
import { useEffect, useState } from 'react';
import type { SyncEngine } from './sync-engine';
import type { RejectedMutation } from './sync-state';

export interface SyncStatus {
  state: 'idle' | 'syncing' | 'offline' | 'error';
  lastSyncAt: string | null;
  /** Changes waiting in the outbox. */
  pending: number;
  oldestPendingAt: string | null;
  /** Unsynced changes older than three days: some mobile browsers evict storage after a week unused. */
  unsyncedWarning: boolean;
  rejected: RejectedMutation[];
  openConflicts: SyncConflict[];
  lastError: string | null;
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
