/**
 * The phone's sync engine. Sends the outbox in order: finding changes as batches of
 * mutations with per-client increasing ids (a retry reuses the ids, so the server skips what it
 * already applied), other changes to their REST routes, photos after the records that own them
 * with backoff; then pulls the change feed into Dexie. Records with changes still waiting are
 * never overwritten by the feed; the push answer brings their server state once they are sent.
 * Only this folder talks to the server; the UI reads Dexie and `status()`.
 */
import type { SyncMutationInput, SyncMutationResult, SyncPushResponse } from '@plummet/shared';
import { backoffMs, unsyncedTooOld } from '@plummet/shared';
import { readMeta, writeMeta, type PlummetDb } from '../local-db/db';
import { idsWithWaitingChanges, listWaitingChanges } from '../local-db/outbox';
import type { FindingRecord, OutboxEntry } from '../local-db/records';
import { SyncHttpError, type SyncTransport } from './sync-transport';
import { clientIdOf, readAssignments, readConflicts, readRejected, type RejectedMutation, SYNC_META } from './sync-state';
import { applyPulledPage, putIfNewer } from './sync-apply';
import type { SyncStatus } from './sync-status';

/** Where the signed-in session (with the user's profile) is kept; the engine reads only its version. */
const SESSION_META = 'session';

export interface SyncEngineOptions {
  /** The device clock (only for local bookkeeping: the server never orders by it). */
  now?: () => Date;
  random?: () => number;
  /** Mutations per push. */
  batchSize?: number;
  /** Changes per pull page. */
  pullLimit?: number;
  /** Told about every push result with the outbox entry it answers (tests reconcile outcomes with it). */
  onResult?: (clientId: string, result: SyncMutationResult, entryId?: number) => void;
}

export type SyncRunOutcome = 'done' | 'offline' | 'error';

type PushableEntry = Extract<OutboxEntry, { entity: 'finding' | 'inspection' | 'control-check' | 'scaffold' | 'user' }>;

/** Every record change travels as a mutation (a scaffold's tag status too); only photo bytes go to their own route. */
const pushable = (entry: OutboxEntry): entry is PushableEntry =>
  entry.entity === 'finding' || entry.entity === 'inspection' || entry.entity === 'control-check' || entry.entity === 'scaffold' || entry.entity === 'user';

export class SyncEngine {
  private running: Promise<SyncRunOutcome> | null = null;
  private again = false;
  private state: SyncStatus['state'] = 'idle';
  private lastError: string | null = null;
  private readonly listeners = new Set<() => void>();
  private readonly now: () => Date;
  private readonly random: () => number;

  constructor(
    readonly database: PlummetDb,
    private readonly transport: SyncTransport,
    private readonly options: SyncEngineOptions = {},
  ) {
    this.now = options.now ?? (() => new Date());
    this.random = options.random ?? Math.random;
  }

  /** Runs one sync (push, then pull). A call during a run queues one more run after it. */
  sync(): Promise<SyncRunOutcome> {
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      let outcome: SyncRunOutcome;
      do {
        this.again = false;
        outcome = await this.runOnce();
      } while (this.again && outcome === 'done');
      return outcome;
    })().finally(() => {
      this.running = null;
    });
    return this.running;
  }

  /** Resolves once no run is in progress (sign-out waits for it before clearing the phone). */
  async whenIdle(): Promise<void> {
    while (this.running) await this.running.catch(() => undefined);
  }

  subscribe(listener: () => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  async status(): Promise<SyncStatus> {
    const waiting = await listWaitingChanges(this.database);
    const oldestPendingAt = waiting.reduce<string | null>((min, e) => (min === null || e.createdAt < min ? e.createdAt : min), null);
    const conflicts = Object.values(await readConflicts(this.database)).filter((c) => c.status === 'open');
    return {
      state: this.state,
      lastSyncAt: (await readMeta<string>(this.database, SYNC_META.lastSyncAt)) ?? null,
      pending: waiting.length,
      oldestPendingAt,
      unsyncedWarning: unsyncedTooOld(oldestPendingAt, this.now()),
      rejected: await readRejected(this.database),
      openConflicts: conflicts,
      lastError: this.lastError,
    };
  }

  private setState(state: SyncStatus['state'], error: string | null = null): void {
    this.state = state;
    this.lastError = error;
    for (const listener of this.listeners) listener();
  }

  private async runOnce(): Promise<SyncRunOutcome> {
    this.setState('syncing');
    try {
      await this.pushOutbox();
      await this.pullChanges();
      await writeMeta(this.database, SYNC_META.lastSyncAt, this.now().toISOString());
      this.setState('idle');
      return 'done';
    } catch (error) {
      if (error instanceof SyncHttpError && error.transient) {
        this.setState('offline', error.message);
        return 'offline';
      }
      this.setState('error', error instanceof Error ? error.message : String(error));
      return 'error';
    }
  }

  private async pushOutbox(): Promise<void> {
    const skipped = new Set<number>();
    for (;;) {
      const entries = (await listWaitingChanges(this.database)).filter((e) => !skipped.has(e.id!));
      const head = entries[0];
      if (!head) return;
      if (pushable(head)) {
        const batch: PushableEntry[] = [];
        for (const e of entries) {
          if (!pushable(e) || batch.length >= (this.options.batchSize ?? 200)) break;
          batch.push(e);
        }
        await this.pushBatch(batch);
      } else if (head.entity === 'photo') {
        if (!(await this.uploadPhoto(head))) skipped.add(head.id!);
      } else {
        await this.sendRest(head);
      }
    }
  }

  /** Gives the entries their mutation ids (kept for retries) and marks them tried, so no later edit folds into them. */
  private async prepare(entries: PushableEntry[]): Promise<{ mutations: SyncMutationInput[]; byMutation: Map<number, number> }> {
    const db = this.database;
    return db.transaction('rw', [db.outbox, db.meta, db.findings, db.inspections, db.controlChecks, db.scaffolds], async () => {
      const assignments = await readAssignments(db);
      let next = (await readMeta<number>(db, SYNC_META.nextMutationId)) ?? 1;
      const mutations: SyncMutationInput[] = [];
      const byMutation = new Map<number, number>();
      for (const listed of entries) {
        const entry = await db.outbox.get(listed.id!);
        if (!entry || !pushable(entry)) break;
        let id = assignments[entry.id!];
        if (id === undefined) {
          id = next++;
          assignments[entry.id!] = id;
        }
        await db.outbox.update(entry.id!, { attempts: entry.attempts + 1 });
        const payload = entry.payload as Record<string, unknown>;
        const seen = typeof payload.version === 'number' ? payload.version : await this.localVersion(entry);
        mutations.push({ id, entity: entry.entity, entityId: entry.entityId, action: entry.action, baseVersion: entry.action === 'create' ? 0 : seen, payload });
        byMutation.set(id, entry.id!);
      }
      await writeMeta(db, SYNC_META.assignments, assignments);
      await writeMeta(db, SYNC_META.nextMutationId, next);
      return { mutations, byMutation };
    });
  }

  /** The version of the record this phone last had from the server (0: never had it). */
  private async localVersion(entry: PushableEntry): Promise<number> {
    const db = this.database;
    switch (entry.entity) {
      case 'finding':
        return (await db.findings.get(entry.entityId))?.version ?? 0;
      case 'inspection':
        return (await db.inspections.get(entry.entityId))?.version ?? 0;
      case 'control-check':
        return (await db.controlChecks.get(entry.entityId))?.version ?? 0;
      case 'scaffold':
        return (await db.scaffolds.get(entry.entityId))?.version ?? 0;
      case 'user': {
        const profile = await readMeta<{ id?: string; version?: number }>(db, SYNC_META.profile);
        const session = await readMeta<{ user?: { id?: string; version?: number } }>(db, SESSION_META);
        const versions = [profile?.id === entry.entityId ? profile.version : undefined, session?.user?.id === entry.entityId ? session.user.version : undefined];
        return Math.max(0, ...versions.filter((v): v is number => typeof v === 'number'));
      }
    }
  }

  private async pushBatch(entries: PushableEntry[]): Promise<void> {
    const clientId = await clientIdOf(this.database);
    const { mutations, byMutation } = await this.prepare(entries);
    if (!mutations.length) return;
    const response = await this.transport.push({ clientId, mutations: mutations as never });
    for (const result of response.results) this.options.onResult?.(clientId, result, byMutation.get(result.id));
    await this.acknowledge(response, byMutation);
  }

  /** Removes the answered entries, keeps the rejected ones to show, and takes the server's copy of records no longer waiting. */
  private async acknowledge(response: SyncPushResponse, byMutation: Map<number, number>): Promise<void> {
    const db = this.database;
    await db.transaction('rw', db.outbox, db.meta, db.findings, async () => {
      const assignments = await readAssignments(db);
      const rejected = await readRejected(db);
      for (const result of response.results) {
        const entryId = byMutation.get(result.id);
        if (entryId === undefined) continue;
        const entry = await db.outbox.get(entryId);
        await db.outbox.delete(entryId);
        delete assignments[entryId];
        if (result.outcome === 'rejected' && entry) {
          rejected.push(this.rejection(entry, result.id, result.reason ?? 'Rejected'));
        }
      }
      await writeMeta(db, SYNC_META.assignments, assignments);
      await writeMeta(db, SYNC_META.rejected, rejected);
      const waiting = await idsWithWaitingChanges(db, 'finding');
      for (const record of response.records) {
        if (!waiting.has(record.id)) await putIfNewer(db, record as FindingRecord);
      }
    });
  }

  private rejection(entry: OutboxEntry, mutationId: number | null, reason: string): RejectedMutation {
    return { mutationId, entity: entry.entity, entityId: entry.entityId, action: entry.action, reason, at: this.now().toISOString() };
  }

  /** A change for a REST route: done on 2xx, kept as rejected on a refusal, retried later when no answer came. */
  private async sendRest(entry: OutboxEntry): Promise<void> {
    await this.database.outbox.update(entry.id!, { attempts: entry.attempts + 1 });
    try {
      await this.transport.send(entry);
    } catch (error) {
      if (!(error instanceof SyncHttpError) || error.transient) throw error;
      await this.reject(entry, error.message);
      return;
    }
    await this.database.outbox.delete(entry.id!);
  }

  private async reject(entry: OutboxEntry, reason: string): Promise<void> {
    const db = this.database;
    await db.transaction('rw', db.outbox, db.meta, async () => {
      await db.outbox.delete(entry.id!);
      await writeMeta(db, SYNC_META.rejected, [...(await readRejected(db)), this.rejection(entry, null, reason)]);
    });
  }

  /** Uploads a photo (its owner was sent before it). False when it waits for its backoff. */
  private async uploadPhoto(entry: OutboxEntry): Promise<boolean> {
    const db = this.database;
    const retryAt = (await readMeta<Record<string, string>>(db, SYNC_META.photoRetryAt)) ?? {};
    if (retryAt[entry.entityId] && Date.parse(retryAt[entry.entityId]!) > this.now().getTime()) return false;
    const photo = await db.photos.get(entry.entityId);
    if (!photo) {
      await db.outbox.delete(entry.id!);
      return true;
    }
    await db.outbox.update(entry.id!, { attempts: entry.attempts + 1 });
    try {
      const takenAt = (entry.payload as { takenAt?: string }).takenAt;
      await this.transport.uploadPhoto(photo, takenAt);
    } catch (error) {
      if (error instanceof SyncHttpError && !error.transient) {
        await this.reject(entry, error.message);
        return true;
      }
      retryAt[entry.entityId] = new Date(this.now().getTime() + backoffMs(entry.attempts + 1, this.random())).toISOString();
      await writeMeta(db, SYNC_META.photoRetryAt, retryAt);
      throw error;
    }
    await db.transaction('rw', db.outbox, db.photos, db.meta, async () => {
      await db.outbox.delete(entry.id!);
      await db.photos.update(photo.id, { uploadedAt: this.now().toISOString() });
      delete retryAt[entry.entityId];
      await writeMeta(db, SYNC_META.photoRetryAt, retryAt);
    });
    return true;
  }

  private async pullChanges(): Promise<void> {
    let cursor = await readMeta<string>(this.database, SYNC_META.cursor);
    const clientId = await clientIdOf(this.database);
    for (;;) {
      const page = await this.transport.pull(cursor, this.options.pullLimit ?? 500, clientId);
      await applyPulledPage(this.database, page);
      cursor = page.cursor;
      if (!page.hasMore) return;
    }
  }
}
