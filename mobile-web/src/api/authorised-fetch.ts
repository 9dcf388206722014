import { accessTokenNeedsRefresh, type StoredSession } from '../features/auth/session';
import { readSession, saveSession } from '../features/auth/session.store';
import { db, type PlummetDb } from '../local-db/db';
import { isGatewayFailure, reportServerReachable } from '../lib/connectivity';
import { ApiError, apiFetch, type ApiRequest } from './http';

type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** Refresh tokens are single-use: two refreshes at once would end the session, so they share one. */
let refreshInFlight: Promise<StoredSession> | null = null;

async function refresh(database: PlummetDb, session: StoredSession, fetchImpl?: FetchLike): Promise<StoredSession> {
  refreshInFlight ??= (async () => {
    try {
      const response = await apiFetch<unknown>('/auth/refresh', { method: 'POST', body: { refreshToken: session.refreshToken } }, fetchImpl);
      // The answer's check (shared's schemas) loads with the first refresh, not with every screen.
      const { sessionFromResponse } = await import('../features/auth/session-response');
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
  const session = await readSession(database);
  if (!session) throw new ApiError(401, 'UNAUTHENTICATED', 'Sign in first.');
  // One refresh-and-retry for the whole app: the same one the sync transport goes through.
  return apiFetch<T>(path, request, fetchWithAccessToken(database, fetchImpl));
}

/**
 * A fetch for code that builds its own requests (the sync engine's transport): adds the access
 * token (renewed first when it has nearly expired), and on a 401 renews once and sends again.
 * With no session, or one that can no longer be renewed, it answers the server's 401 as it came.
 */
export function fetchWithAccessToken(database: PlummetDb = db, fetchImpl: FetchLike = (input, init) => fetch(input, init)): FetchLike {
  const send = async (input: string, init: RequestInit | undefined, token: string) => {
    const headers = new Headers(init?.headers);
    headers.set('Authorization', `Bearer ${token}`);
    // Answers and failures tell the online badge, as apiFetch's do.
    try {
      const response = await fetchImpl(input, { ...init, headers, credentials: 'same-origin' });
      reportServerReachable(!isGatewayFailure(response.status));
      return response;
    } catch (error) {
      reportServerReachable(false);
      throw error;
    }
  };
  return async (input, init) => {
    let session = await readSession(database);
    if (!session) return fetchImpl(input, init);
    if (accessTokenNeedsRefresh(session.accessToken)) session = await refresh(database, session, fetchImpl).catch(() => session!);
    const response = await send(input, init, session.accessToken);
    if (response.status !== 401) return response;
    let renewed: StoredSession;
    try {
      renewed = await refresh(database, session, fetchImpl);
    } catch {
      return response;
    }
    return send(input, init, renewed.accessToken);
  };
}
