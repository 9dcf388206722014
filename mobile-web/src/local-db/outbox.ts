import type { PlummetDb } from './db';
import type { OutboxChange, OutboxEntry } from './records';

/**
 * The outbox: every local change the server has not heard about yet, in the order it was made.
 * Stores call enqueueChange inside the same Dexie transaction as the record it describes, so a
 * record never exists without its entry (or the other way round). src/sync/ sends and removes them.
 *
 * Changes to the same record are folded together while they wait, so a finding edited five times
 * offline is sent as one create. Only untried entries (attempts 0) are folded: one the sync has
 * already tried may have reached the server.
 */

type Mergeable = Extract<OutboxChange, { action: 'create' | 'update' | 'put' }>;

function foldInto(waiting: OutboxEntry, change: OutboxChange): OutboxChange | undefined {
  if (waiting.entity !== change.entity || waiting.attempts > 0) return undefined;
  const { version: _ignored, ...fields } = change.payload as Record<string, unknown>;
  void _ignored;
  if (change.action === 'update' && (waiting.action === 'create' || waiting.action === 'update')) {
    return { ...waiting, payload: { ...waiting.payload, ...fields } } as Mergeable;
  }
  if (change.action === 'put' && waiting.action === 'put') return { ...waiting, payload: change.payload } as Mergeable;
  return undefined;
}

/** Which waiting entries a change may fold into: create/update into the record's last create or update. */
function canFold(change: OutboxChange): boolean {
  if (change.entity === 'inspection') return false; // its create and update bodies differ too much to merge
  return change.action === 'update' || change.action === 'put';
}

/**
 * Adds a change to the outbox, or folds it into a waiting one for the same record. Call it inside
 * a transaction that includes `database.outbox`. Returns the entry's id.
 */
export async function enqueueChange(database: PlummetDb, entityId: string, change: OutboxChange, now = new Date()): Promise<number> {
  if (canFold(change)) {
    const waiting = await database.outbox.where('[entity+entityId]').equals([change.entity, entityId]).toArray();
    for (const entry of waiting.reverse()) {
      const folded = foldInto(entry, change);
      if (folded && entry.id !== undefined) {
        await database.outbox.put({ ...entry, ...folded });
        return entry.id;
      }
    }
  }
  const entry: OutboxEntry = { ...change, entityId, op: 'put', createdAt: now.toISOString(), attempts: 0 };
  return (await database.outbox.add(entry)) as number;
}

/** How many changes wait to be sent (the badge). */
export function countWaitingChanges(database: PlummetDb): Promise<number> {
  return database.outbox.count();
}

/** The waiting changes, oldest first. */
export function listWaitingChanges(database: PlummetDb): Promise<OutboxEntry[]> {
  return database.outbox.orderBy('id').toArray();
}

/** Record ids with a change still waiting: a download must not overwrite them. */
export async function idsWithWaitingChanges(database: PlummetDb, entity: OutboxEntry['entity']): Promise<Set<string>> {
  const entries = await database.outbox.toArray();
  return new Set(entries.filter((entry) => entry.entity === entity).map((entry) => entry.entityId));
}
