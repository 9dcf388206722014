import { useMutation } from '@tanstack/react-query';
import { isOnline } from '../../lib/connectivity';
import { db } from '../../local-db/db';
import { withAppSyncStopped } from '../../sync/app-sync';
import { signOutOnServer } from './auth.api';
import { readSession, signOutLocally } from './session.store';

/**
 * Signs out: tells the server when it can be reached (ending the refresh token), then clears
 * every record, photo and waiting change from the phone. The screen has already warned.
 */
export function useSignOutMutation() {
  return useMutation({
    // Stop syncing first, until the phone is clear: a run still writing after the clear would leave records behind.
    mutationFn: () =>
      withAppSyncStopped(async () => {
        const session = await readSession(db);
        if (session && isOnline()) await signOutOnServer(session.refreshToken).catch(() => undefined);
        await signOutLocally(db);
      }),
    meta: { errorToast: 'Signing out failed. Close Plummet and try again.' },
  });
}
