import { db } from '../../local-db/db';
import { signIn, type SignInCredentials } from './auth.api';
import type { StoredSession } from './session';
import { sessionFromResponse } from './session-response';
import { startSession } from './session.store';

export { describeSignInError } from './auth.api';

/**
 * Signs in (needs a connection) and keeps the session on the phone. The sign-in form loads this
 * module only when it is sent, so the form itself needs neither the local database nor zod.
 */
export async function signInAndKeep(credentials: SignInCredentials): Promise<StoredSession> {
  const session = sessionFromResponse(await signIn(credentials), new Date());
  await startSession(db, session);
  return session;
}
