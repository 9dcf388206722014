import { isGatewayFailure, reportServerReachable } from '../lib/connectivity';

/**
 * The one way the app calls the Plummet API. The server answers every error as
 * `{ code, message, issues? }`; this turns those, and the cases where no answer
 * comes at all, into ApiError so callers can branch on `code`.
 */

/** Client-side codes for failures that never reached the server's error filter. */
export const ClientErrorCode = {
  /** No connection, DNS failure, server stopped (fetch rejected, or a gateway answered 502/504). */
  Offline: 'CLIENT_OFFLINE',
  /** An answer that is not the server's JSON error shape (e.g. a proxy's HTML page). */
  UnexpectedResponse: 'CLIENT_UNEXPECTED_RESPONSE',
} as const;

export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    /** HTTP status, or 0 when the request never got an answer. */
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: unknown,
  ) {
    super(message);
  }

  get isOffline(): boolean {
    return this.code === ClientErrorCode.Offline;
  }
}

export interface ApiRequest {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** Sent as `Authorization: Bearer …` (src/api/authorised-fetch.ts supplies it). */
  accessToken?: string;
}

type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** Calls `/api${path}` and returns the parsed JSON body (undefined for 204). */
export async function apiFetch<T>(path: string, request: ApiRequest = {}, fetchImpl: FetchLike = fetch): Promise<T> {
  return apiSend<T>(
    path,
    {
      method: request.method ?? (request.body === undefined ? 'GET' : 'POST'),
      headers: {
        Accept: 'application/json',
        ...(request.body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...(request.accessToken ? { Authorization: `Bearer ${request.accessToken}` } : {}),
      },
      body: request.body === undefined ? undefined : JSON.stringify(request.body),
      signal: request.signal,
    },
    fetchImpl,
  );
}

/**
 * The one request-and-answer path of the app: sends `init` as it is (a form upload, a prepared
 * JSON body) to `/api${path}` and turns the answer, or its absence, into a body or an ApiError.
 * With fetchWithAccessToken (src/api/authorised-fetch.ts) as `fetchImpl`, it renews the session once on a 401.
 */
export async function apiSend<T>(path: string, init: RequestInit, fetchImpl: FetchLike = fetch): Promise<T> {
  let response: Response;
  try {
    response = await fetchImpl(`/api${path}`, { credentials: 'same-origin', ...init });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    reportServerReachable(false);
    throw new ApiError(0, ClientErrorCode.Offline, 'No connection to the Plummet server.');
  }

  if (isGatewayFailure(response.status)) {
    reportServerReachable(false);
    throw new ApiError(response.status, ClientErrorCode.Offline, 'No connection to the Plummet server.');
  }
  reportServerReachable(true);
  if (response.status === 204) return undefined as T;
  const body: unknown = await response.json().catch(() => undefined);
  if (response.ok) return body as T;

  if (isErrorBody(body)) throw new ApiError(response.status, body.code, body.message, body.issues);
  throw new ApiError(response.status, ClientErrorCode.UnexpectedResponse, `The server answered ${response.status}.`);
}

function isErrorBody(body: unknown): body is { code: string; message: string; issues?: unknown } {
  return (
    typeof body === 'object' &&
    body !== null &&
    typeof (body as { code?: unknown }).code === 'string' &&
    typeof (body as { message?: unknown }).message === 'string'
  );
}
