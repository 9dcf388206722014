import type { StoredSession } from './session';

export type SignInOutcome = { session: StoredSession } | { error: string };

/**
 * One try at signing in with what the person typed: the words to show when it fails, the session
 * (kept on the phone) when it works. Shared by the form inside the app and the pre-rendered
 * sign-in page. The local database and the session's schema load only now, not with the form.
 */
export async function attemptSignIn(email: string, password: string): Promise<SignInOutcome> {
  if (!email.trim() || !password) return { error: 'Enter your email and password.' };
  const { signInAndKeep, describeSignInError } = await import('./sign-in');
  try {
    return { session: await signInAndKeep({ email: email.trim(), password }) };
  } catch (failure) {
    return { error: describeSignInError(failure) };
  }
}
