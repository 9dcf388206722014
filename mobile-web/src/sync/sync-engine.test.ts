import 'fake-indexeddb/auto';
import type { SyncPullResponse, SyncPush, SyncPushResponse } from '@plummet/shared';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { enqueueChange } from '../local-db/outbox';
import type { OutboxEntry, PhotoRecord } from '../local-db/records';
import { dropTestDatabases, freshDb, sampleFinding } from '../local-db/testing';
import { SyncEngine } from './sync-engine';
import { SYNC_META } from './sync-state';
import { SyncHttpError, type SyncTransport } from './sync-transport';
import { startSyncTriggers } from './sync-triggers';

afterEach(dropTestDatabases);

/** A server stand-in that applies everything (or rejects what `reject` says) and records the calls. */
function fakeServer(options: { reject?: (id: number) => string | undefined; photoFails?: number } = {}) {
  const calls: string[] = [];
  const pushes: SyncPush[] = [];
  let photoFailures = options.photoFails ?? 0;
  const transport: SyncTransport = {
    async push(body): Promise<SyncPushResponse> {
      calls.push(`push ${body.mutations.map((m) => m.id).join(',')}`);
      pushes.push(body);
      const results = body.mutations.map((m) => {
        const reason = options.reject?.(m.id);
        return { id: m.id, outcome: reason ? ('rejected' as const) : ('applied' as const), reason: reason ?? null, replayed: false, conflictIds: [] };
      });
      return { lastMutationId: body.mutations.at(-1)!.id, results, records: [] };
    },
    async pull(): Promise<SyncPullResponse> {
      calls.push('pull');
      return { changes: [], cursor: '5.7', hasMore: false };
    },
    async send(entry: OutboxEntry) {
      calls.push(`send ${entry.entity}:${entry.action}`);
    },
    async uploadPhoto(photo: PhotoRecord) {
      calls.push(`photo ${photo.id}`);
      if (photoFailures-- > 0) throw new SyncHttpError(0, 'CLIENT_OFFLINE', 'No connection');
    },
  };
  return { transport, calls, pushes };
}

const finding = (n: number) => sampleFinding({ id: `0f000000-0000-4000-8000-00000000000${n}`, version: 0 });

describe('the sync engine', () => {
  it('pushes every record change as mutations with rising ids, in order, and uploads photos after their owner', async () => {
    const db = freshDb();
    const server = fakeServer();
    await enqueueChange(db, 'insp-1', { entity: 'inspection', action: 'create', payload: { id: 'insp-1' } as never });
    await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'create', payload: { id: finding(1).id } as never });
    await db.photos.put({ id: 'photo-1', ownerType: 'finding', ownerId: finding(1).id, mimeType: 'image/jpeg', data: new ArrayBuffer(4), sizeBytes: 4, width: 1, height: 1, createdAt: '2026-03-01T00:00:00Z' });
    await enqueueChange(db, 'photo-1', { entity: 'photo', action: 'upload', payload: { id: 'photo-1', ownerType: 'finding', ownerId: finding(1).id } });
    await enqueueChange(db, finding(2).id, { entity: 'finding', action: 'create', payload: { id: finding(2).id } as never });

    expect(await new SyncEngine(db, server.transport).sync()).toBe('done');

    expect(server.calls).toEqual(['push 1,2', 'photo photo-1', 'push 3', 'pull']);
    expect(server.pushes[0]!.mutations.map((m) => `${m.entity}:${m.action}`)).toEqual(['inspection:create', 'finding:create']);
    expect(await db.outbox.count()).toBe(0);
    expect((await db.photos.get('photo-1'))?.uploadedAt).toBeDefined();
    expect((await db.meta.get(SYNC_META.cursor))?.value).toBe('5.7');
  });

  it('sends the same mutation ids again after a lost answer, and never folds a later edit into a tried entry', async () => {
    const db = freshDb();
    const server = fakeServer();
    let fail = true;
    const flaky: SyncTransport = {
      ...server.transport,
      async push(body) {
        const answer = await server.transport.push(body);
        if (fail) {
          fail = false;
          throw new SyncHttpError(0, 'CLIENT_OFFLINE', 'The answer was lost');
        }
        return answer;
      },
    };
    const engine = new SyncEngine(db, flaky);
    await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'update', payload: { notes: 'one' } });
    expect(await engine.sync()).toBe('offline');
    await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'update', payload: { notes: 'two' } });
    expect(await engine.sync()).toBe('done');
    expect(server.pushes.map((p) => p.mutations.map((m) => [m.id, m.payload.notes]))).toEqual([[[1, 'one']], [[1, 'one'], [2, 'two']]]);
    expect(new Set(server.pushes.map((p) => p.clientId)).size).toBe(1);
  });

  it('keeps rejected mutations to show, and warns about changes unsynced for more than three days', async () => {
    const db = freshDb();
    const server = fakeServer({ reject: (id) => (id === 1 ? 'A finding cannot move from open to verified' : undefined) });
    let now = new Date('2026-03-01T08:00:00Z');
    const engine = new SyncEngine(db, { ...server.transport, pull: () => Promise.reject(new SyncHttpError(0, 'CLIENT_OFFLINE', 'offline')) }, { now: () => now });
    await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'state', payload: { to: 'verified', note: '' } }, now);
    await engine.sync();
    await enqueueChange(db, finding(2).id, { entity: 'finding', action: 'create', payload: { id: finding(2).id } as never }, now);
    now = new Date('2026-03-04T09:00:00Z');
    const status = await engine.status();
    expect(status.rejected).toEqual([expect.objectContaining({ mutationId: 1, reason: 'A finding cannot move from open to verified' })]);
    expect(status).toMatchObject({ state: 'offline', pending: 1, unsyncedWarning: true });
  });

  it('backs a failed photo upload off without holding up later changes', async () => {
    const db = freshDb();
    const server = fakeServer({ photoFails: 1 });
    const now = new Date('2026-03-01T08:00:00Z');
    const engine = new SyncEngine(db, server.transport, { now: () => now, random: () => 0 });
    await db.photos.put({ id: 'photo-1', ownerType: 'finding', ownerId: finding(1).id, mimeType: 'image/jpeg', data: new ArrayBuffer(4), sizeBytes: 4, width: 1, height: 1, createdAt: now.toISOString() });
    await enqueueChange(db, 'photo-1', { entity: 'photo', action: 'upload', payload: { id: 'photo-1', ownerType: 'finding', ownerId: finding(1).id } });
    expect(await engine.sync()).toBe('offline');
    await enqueueChange(db, finding(2).id, { entity: 'finding', action: 'create', payload: { id: finding(2).id } as never });
    expect(await engine.sync()).toBe('done');
    expect(server.calls).toEqual(['photo photo-1', 'push 1', 'pull']);
    expect(await db.outbox.count()).toBe(1);
  });
});

describe('sync triggers', () => {
  it('syncs at start, when the connection returns, when the app is visible again and on a timer', () => {
    vi.useFakeTimers();
    try {
      const handlers: Record<string, (event?: unknown) => void> = {};
      const target = { addEventListener: (type: string, fn: (event: never) => void) => void (handlers[type] = fn as never), removeEventListener: vi.fn() };
      const doc = { ...target, visibilityState: 'hidden' };
      const noWorker = { addEventListener: vi.fn(), removeEventListener: vi.fn() };
      const engine = { sync: vi.fn(async () => 'done' as const) };
      const stop = startSyncTriggers(engine, { window: target, document: doc, serviceWorker: noWorker, intervalMs: 1000 });
      expect(engine.sync).toHaveBeenCalledTimes(1);
      handlers.online!();
      handlers.visibilitychange!();
      expect(engine.sync).toHaveBeenCalledTimes(2);
      doc.visibilityState = 'visible';
      handlers.visibilitychange!();
      vi.advanceTimersByTime(1000);
      expect(engine.sync).toHaveBeenCalledTimes(4);
      stop();
      vi.advanceTimersByTime(5000);
      expect(engine.sync).toHaveBeenCalledTimes(4);
    } finally {
      vi.useRealTimers();
    }
  });

  it('syncs when the service worker relays a Background Sync wake-up, and only for that message', () => {
    const handlers: Record<string, (event: { data: unknown }) => void> = {};
    const worker = { addEventListener: (type: string, fn: (event: never) => void) => void (handlers[type] = fn as never), removeEventListener: vi.fn() };
    const quiet = { addEventListener: vi.fn(), removeEventListener: vi.fn() };
    const engine = { sync: vi.fn(async () => 'done' as const) };
    const stop = startSyncTriggers(engine, { window: quiet, document: quiet, serviceWorker: worker, intervalMs: 60_000 });
    expect(engine.sync).toHaveBeenCalledTimes(1);
    handlers.message!({ data: { type: 'something-else' } });
    expect(engine.sync).toHaveBeenCalledTimes(1);
    handlers.message!({ data: { type: 'plummet-sync' } });
    expect(engine.sync).toHaveBeenCalledTimes(2);
    stop();
    expect(worker.removeEventListener).toHaveBeenCalledWith('message', expect.any(Function));
  });

  it('marks entries as tried before their push leaves, so an edit made while it is on its way waits as a new entry', async () => {
    const db = freshDb();
    const server = fakeServer();
    const seenAttempts: number[] = [];
    const watching: SyncTransport = {
      ...server.transport,
      async push(body) {
        seenAttempts.push(...(await db.outbox.toArray()).map((entry) => entry.attempts));
        if (seenAttempts.length === 1) await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'update', payload: { exposure: 'public' } });
        return server.transport.push(body);
      },
    };
    await enqueueChange(db, finding(1).id, { entity: 'finding', action: 'update', payload: { notes: 'one' } });
    await new SyncEngine(db, watching).sync();
    expect(seenAttempts[0]).toBe(1);
    expect(server.pushes.map((push) => push.mutations.map((m) => m.payload))).toEqual([[{ notes: 'one' }], [{ exposure: 'public' }]]);
  });
});
