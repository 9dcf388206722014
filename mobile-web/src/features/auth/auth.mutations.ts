import { useMutation } from '@tanstack/react-query';
import { isOnline } from '../../lib/connectivity';
import { db } from '../../local-db/db';
import { stopAppSync } from '../../sync/app-sync';
import { signIn, signOutOnServer, type SignInCredentials } from './auth.api';
import { sessionFromResponse } from './session';
import { readSession, signOutLocally, startSession } from './session.store';

/** Signs in (needs a connection) and keeps the session on the phone. Errors show in the form. */
export function useSignInMutation() {
  return useMutation({
    mutationFn: async (credentials: SignInCredentials) => {
      const session = sessionFromResponse(await signIn(credentials), new Date());
      await startSession(db, session);
      return session;
    },
    meta: { errorToast: false },
  });
}

/**
 * Signs out: tells the server when it can be reached (ending the refresh token), then clears
 * every record, photo and waiting change from the phone. The screen has already warned.
 */
export function useSignOutMutation() {
  return useMutation({
    mutationFn: async () => {
      // Stop syncing first: a run still writing after the clear would leave records behind.
      await stopAppSync();
      const session = await readSession(db);
      if (session && isOnline()) await signOutOnServer(session.refreshToken).catch(() => undefined);
      await signOutLocally(db);
    },
    meta: { errorToast: 'Signing out failed. Close Plummet and try again.' },
  });
}
