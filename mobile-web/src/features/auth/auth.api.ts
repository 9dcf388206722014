import { ApiError, apiFetch } from '../../api/http';

export interface SignInCredentials {
  email: string;
  password: string;
}

/** Posts the credentials to the server; the answer is a Session (parsed by sessionFromResponse). */
export function signIn(credentials: SignInCredentials, fetchImpl?: typeof fetch): Promise<unknown> {
  return apiFetch<unknown>('/auth/sign-in', { method: 'POST', body: credentials }, fetchImpl);
}

/** Ends the session on the server (every device it was renewed on). Always answered 204. */
export function signOutOnServer(refreshToken: string, fetchImpl?: typeof fetch): Promise<void> {
  return apiFetch<void>('/auth/sign-out', { method: 'POST', body: { refreshToken } }, fetchImpl);
}

/** A sentence for the sign-in form, for any failure of signIn. */
export function describeSignInError(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Sign-in failed. Please try again.';
  if (error.isOffline) return 'No connection to the Plummet server. Signing in needs one; try again when you have signal.';
  if (error.status === 404) return 'Sign-in is not available on this server yet.';
  if (error.status === 401) return 'That email and password do not match an account.';
  if (error.status === 429) return 'Too many attempts. Wait a minute, then try again.';
  if (error.status >= 500) return 'The Plummet server could not sign you in just now. Try again shortly.';
  return error.message;
}
