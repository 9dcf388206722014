/** Writing what the server sent into Dexie: pulled pages and the records a push answer carries. */
import type { SyncConflict, SyncPullResponse } from '@plummet/shared';
import { writeMeta, type PlummetDb } from '../local-db/db';
import { idsWithWaitingChanges } from '../local-db/outbox';
import type { FindingRecord } from '../local-db/records';
import { readConflicts, SYNC_META } from './sync-state';

/** Versions only grow on the server: an older copy (a slow answer) never replaces a newer one. */
export async function putIfNewer(database: PlummetDb, record: FindingRecord): Promise<void> {
  const local = await database.findings.get(record.id);
  if (!local || record.version >= local.version) await database.findings.put(record);
}

/**
 * One page of the feed, with its cursor, in one transaction. A finding with changes still waiting
 * keeps the phone's copy (its base version stays the one the user edited from); a conflict is kept
 * while open and dropped once settled.
 */
export async function applyPulledPage(database: PlummetDb, page: SyncPullResponse): Promise<void> {
  await database.transaction('rw', database.findings, database.outbox, database.meta, async () => {
    const waiting = await idsWithWaitingChanges(database, 'finding');
    const conflicts: Record<string, SyncConflict> = await readConflicts(database);
    for (const change of page.changes) {
      if (change.type === 'finding') {
        if (!waiting.has(change.record.id)) await putIfNewer(database, change.record as FindingRecord);
      } else if (change.type === 'conflict') {
        if (change.record.status === 'open') conflicts[change.record.id] = change.record;
        else delete conflicts[change.record.id];
      }
      // Other record types are not stored on the phone yet.
    }
    await writeMeta(database, SYNC_META.conflicts, conflicts);
    await writeMeta(database, SYNC_META.cursor, page.cursor);
  });
}
