/** What the app shows about sync (the screens read it through features/sync/sync-hooks.ts). */
import type { SyncConflict } from '@plummet/shared';
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
