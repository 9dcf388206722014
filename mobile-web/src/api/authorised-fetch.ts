import { accessTokenNeedsRefresh, sessionFromResponse, type StoredSession } from '../features/auth/session';
import { readSession, saveSession } from '../features/auth/session.store';
import { db, type PlummetDb } from '../local-db/db';
import { ApiError, apiFetch, type ApiRequest } from './http';

type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** Refresh tokens are single-use: two refreshes at once would end the session, so they share one. */
let refreshInFlight: Promise<StoredSession> | null = null;

async function refresh(database: PlummetDb, session: StoredSession, fetchImpl?: FetchLike): Promise<StoredSession> {
  refreshInFlight ??= (async () => {
    try {
      const response = await apiFetch<unknown>('/auth/refresh', { method: 'POST', body: { refreshToken: session.refreshToken } }, fetchImpl);
      const renewed = sessionFromResponse(response, new Date(), session.signedInAt);
      await saveSession(database, renewed);
      return renewed;
    } catch (error) {
      // The server ended the session (expired, revoked, renewed elsewhere): say so on every screen.
      // The phone's records stay; signing in again as the same user carries on with them.
      if (error instanceof ApiError && error.status === 401) await saveSession(database, { ...session, refreshExpiresAt: new Date().toISOString() });
      throw error;
    } finally {
      refreshInFlight = null;
    }
  })();
  return refreshInFlight;
}

/**
 * Calls the API as the signed-in user: renews the access token when it has expired (or when the
 * server says so, once) and keeps the rotated refresh token. Throws ApiError 401 UNAUTHENTICATED
 * when there is no session or it can no longer be renewed.
 */
export async function authorisedFetch<T>(path: string, request: ApiRequest = {}, database: PlummetDb = db, fetchImpl?: FetchLike): Promise<T> {
  let session = await readSession(database);
  if (!session) throw new ApiError(401, 'UNAUTHENTICATED', 'Sign in first.');
  if (accessTokenNeedsRefresh(session.accessToken)) session = await refresh(database, session, fetchImpl);
  try {
    return await apiFetch<T>(path, { ...request, accessToken: session.accessToken }, fetchImpl);
  } catch (error) {
    if (!(error instanceof ApiError) || error.status !== 401) throw error;
    const renewed = await refresh(database, session, fetchImpl);
    return apiFetch<T>(path, { ...request, accessToken: renewed.accessToken }, fetchImpl);
  }
}
