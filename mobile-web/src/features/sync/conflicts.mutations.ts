import type { SyncConflictResolve } from '@plummet/shared';
import { useMutation } from '@tanstack/react-query';
import { ApiError } from '../../api/http';
import { db } from '../../local-db/db';
import { currentSyncEngine } from '../../sync/app-sync';
import { forgetConflict } from '../../sync/sync-state';
import { resolveConflict } from './conflicts.api';

export const NEEDS_CONNECTION = 'Settling a conflict needs a connection. Connect and try again; nothing has changed yet.';

/** Settles a conflict, then syncs so the finding on this phone shows the settled value. */
export function useResolveConflictMutation() {
  return useMutation({
    mutationFn: async ({ id, body }: { id: string; body: SyncConflictResolve }) => {
      if (typeof navigator !== 'undefined' && navigator.onLine === false) throw new ApiError(0, 'CLIENT_OFFLINE', NEEDS_CONNECTION);
      const settled = await resolveConflict(id, body);
      await forgetConflict(db, id);
      await currentSyncEngine()?.sync();
      return settled;
    },
    meta: { errorToast: false },
  });
}

/** What to tell the user when settling failed. */
export function describeResolveError(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.isOffline || error.status === 0) return NEEDS_CONNECTION;
    if (error.code === 'CONFLICT') return 'Someone has already settled this conflict. Sync to see the value they kept.';
    return error.message;
  }
  return 'The conflict could not be settled. Try again.';
}
