/**
 * How the sync engine reaches the server. `fetch` is injected (the app passes one that adds the
 * access token; tests pass a flaky one), so the engine runs in Node over fake-indexeddb too.
 */
import { SyncPullResponseSchema, SyncPushResponseSchema, unpackPullPage, type SyncPullResponse, type SyncPush, type SyncPushResponse } from '@plummet/shared';
import { ApiError, apiSend } from '../api/http';
import type { OutboxEntry, PhotoRecord } from '../local-db/records';

export type FetchLike = (input: string, init?: RequestInit) => Promise<Response>;

/** A failure with the server's answer (status and code), or status 0 when no answer came. */
export class SyncHttpError extends Error {
  override readonly name = 'SyncHttpError';
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly issues?: { path: unknown[]; code: string; message: string }[],
  ) {
    super(message);
  }

  /** Worth retrying later: no answer, the server busy or failing, or the session to renew. */
  get transient(): boolean {
    return this.status === 0 || this.status >= 500 || this.status === 401 || this.status === 408 || this.status === 429;
  }
}

export interface SyncTransport {
  push(body: SyncPush): Promise<SyncPushResponse>;
  /** `siteId`: a first pull of that site alone (making it available offline), under its own cursor. */
  pull(cursor: string | undefined, limit: number, clientId?: string, siteId?: string): Promise<SyncPullResponse>;
  /** An outbox change the push protocol does not carry, sent to its REST route (none today: kept for changes of older app versions). */
  send(entry: OutboxEntry): Promise<void>;
  uploadPhoto(photo: PhotoRecord, takenAt?: string): Promise<void>;
}

/** Through the app's one HTTP client (src/api/http.ts); its ApiError becomes the engine's SyncHttpError. */
async function call(fetchImpl: FetchLike, path: string, init: RequestInit): Promise<unknown> {
  try {
    return await apiSend<unknown>(path, init, fetchImpl);
  } catch (error) {
    if (!(error instanceof ApiError)) throw new SyncHttpError(0, 'CLIENT_OFFLINE', error instanceof Error ? error.message : 'No connection');
    throw new SyncHttpError(error.status, error.code, error.message, error.issues as SyncHttpError['issues']);
  }
}

const json = (method: string, body?: unknown): RequestInit => ({
  method,
  headers: { Accept: 'application/json', ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
  body: body === undefined ? undefined : JSON.stringify(body),
});

/** The REST route of each change the push does not carry. */
function restOf(entry: OutboxEntry): { method: string; path: string; body: unknown } | undefined {
  switch (`${entry.entity}:${entry.action}`) {
    case 'inspection:create':
      return { method: 'POST', path: '/inspections', body: entry.payload };
    case 'inspection:update':
      return { method: 'PATCH', path: `/inspections/${entry.entityId}`, body: entry.payload };
    case 'inspection:finish':
      return { method: 'POST', path: `/inspections/${entry.entityId}/finish`, body: entry.payload };
    case 'control-check:put': {
      const { inspectionId, control, ...body } = entry.payload as { inspectionId: string; control: string };
      return { method: 'PUT', path: `/inspections/${inspectionId}/control-checks/${control}`, body };
    }
    case 'user:update':
      return { method: 'PATCH', path: '/users/me', body: entry.payload };
    default:
      return undefined;
  }
}

export function httpSyncTransport(fetchImpl: FetchLike): SyncTransport {
  return {
    async push(body) {
      return SyncPushResponseSchema.parse(await call(fetchImpl, '/sync/push', json('POST', body)));
    },
    async pull(cursor, limit, clientId, siteId) {
      // Findings come as rows, without their keys (about half the bytes to download and parse), and
      // are turned back into records before they are checked.
      const query = new URLSearchParams({
        limit: String(limit),
        format: 'rows',
        ...(cursor ? { cursor } : {}),
        ...(clientId ? { clientId } : {}),
        ...(siteId ? { siteId } : {}),
      });
      return SyncPullResponseSchema.parse(unpackPullPage(await call(fetchImpl, `/sync/pull?${query}`, json('GET'))));
    },
    async send(entry) {
      const rest = restOf(entry);
      if (!rest) throw new SyncHttpError(400, 'CLIENT_UNSUPPORTED', `No route for ${entry.entity} ${entry.action}`);
      await call(fetchImpl, rest.path, json(rest.method, rest.body));
    },
    async uploadPhoto(photo, takenAt) {
      const form = new FormData();
      form.set('id', photo.id);
      form.set('ownerType', photo.ownerType);
      form.set('ownerId', photo.ownerId);
      if (takenAt) form.set('takenAt', takenAt);
      const blob = photo.data instanceof Blob ? photo.data : new Blob([photo.data], { type: photo.mimeType });
      form.set('file', blob, `${photo.id}.jpg`);
      await call(fetchImpl, '/photos', { method: 'POST', body: form, headers: { Accept: 'application/json' } });
    },
  };
}
