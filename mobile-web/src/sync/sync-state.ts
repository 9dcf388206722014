/**
 * What the sync engine remembers on the phone, in the meta table (no Dexie schema change): the
 * client id, the change-feed cursor, which outbox entries carry which mutation ids, the rejected
 * mutations and open conflicts to show, and when the last sync finished.
 */
import type { SyncConflict } from '@plummet/shared';
import { readMeta, writeMeta, type PlummetDb } from '../local-db/db';
import { newId } from '../local-db/ids';

export const SYNC_META = {
  clientId: 'sync.clientId',
  cursor: 'sync.cursor',
  nextMutationId: 'sync.nextMutationId',
  /** outbox entry id → the mutation id it was first sent with (a retry must reuse it). */
  assignments: 'sync.assignments',
  rejected: 'sync.rejected',
  conflicts: 'sync.conflicts',
  lastSyncAt: 'sync.lastSyncAt',
  /** The signed-in user's profile and settings as the change feed last carried them. */
  profile: 'sync.profile',
  /** Photo id → earliest time of the next upload attempt (backoff). */
  photoRetryAt: 'sync.photoRetryAt',
} as const;

export interface RejectedMutation {
  mutationId: number | null;
  entity: string;
  entityId: string;
  action: string;
  reason: string;
  at: string;
}

/** This database's client id, made on first use (a wiped phone starts again as a new client). */
export async function clientIdOf(database: PlummetDb): Promise<string> {
  return database.transaction('rw', database.meta, async () => {
    const existing = await readMeta<string>(database, SYNC_META.clientId);
    if (existing) return existing;
    const id = newId();
    await writeMeta(database, SYNC_META.clientId, id);
    return id;
  });
}

export async function readAssignments(database: PlummetDb): Promise<Record<string, number>> {
  return (await readMeta<Record<string, number>>(database, SYNC_META.assignments)) ?? {};
}

export async function readRejected(database: PlummetDb): Promise<RejectedMutation[]> {
  return (await readMeta<RejectedMutation[]>(database, SYNC_META.rejected)) ?? [];
}

export async function readConflicts(database: PlummetDb): Promise<Record<string, SyncConflict>> {
  return (await readMeta<Record<string, SyncConflict>>(database, SYNC_META.conflicts)) ?? {};
}

/** Forgets a rejected mutation once the user has seen it. */
export async function dismissRejected(database: PlummetDb, index: number): Promise<void> {
  await database.transaction('rw', database.meta, async () => {
    const list = await readRejected(database);
    list.splice(index, 1);
    await writeMeta(database, SYNC_META.rejected, list);
  });
}

/** Drops a conflict the user has just settled (the next pull would drop it too). */
export async function forgetConflict(database: PlummetDb, id: string): Promise<void> {
  await database.transaction('rw', database.meta, async () => {
    const conflicts = await readConflicts(database);
    delete conflicts[id];
    await writeMeta(database, SYNC_META.conflicts, conflicts);
  });
}
