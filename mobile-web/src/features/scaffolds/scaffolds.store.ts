import type { ScaffoldStatusChange } from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import { enqueueChange } from '../../local-db/outbox';
import type { ScaffoldRecord } from '../../local-db/records';

export class ScaffoldNotOnPhoneError extends Error {
  constructor() {
    super('This scaffold is not on this phone.');
    this.name = 'ScaffoldNotOnPhoneError';
  }
}

/**
 * Sets a scaffold's tag status on the phone: the record and its outbox entry in one transaction, so
 * it works with no signal and reaches the server at the next sync. Its version stays the one the
 * phone last had from the server (the base the server merges from); if another tag was set
 * meanwhile, the server keeps the more restrictive one and a conflict to settle.
 */
export async function changeScaffoldStatus(database: PlummetDb, scaffoldId: string, change: ScaffoldStatusChange, now = new Date()): Promise<ScaffoldRecord> {
  return database.transaction('rw', database.scaffolds, database.outbox, async () => {
    const scaffold = await database.scaffolds.get(scaffoldId);
    if (!scaffold) throw new ScaffoldNotOnPhoneError();
    const setAt = scaffold.status === change.status ? scaffold.statusSetAt : now.toISOString();
    const record: ScaffoldRecord = { ...scaffold, status: change.status, statusSetAt: setAt, updatedAt: now.toISOString() };
    await database.scaffolds.put(record);
    await enqueueChange(database, scaffoldId, { entity: 'scaffold', action: 'status', payload: change }, now);
    return record;
  });
}
