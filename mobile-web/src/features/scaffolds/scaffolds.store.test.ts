import 'fake-indexeddb/auto';
import type { SyncPullResponse, SyncPush, SyncPushResponse } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { listWaitingChanges } from '../../local-db/outbox';
import { dropTestDatabases, freshDb, ORG_ID, scaffold } from '../../local-db/testing';
import { applyPulledPage } from '../../sync/sync-apply';
import { SyncEngine } from '../../sync/sync-engine';
import type { SyncTransport } from '../../sync/sync-transport';
import { changeScaffoldStatus, ScaffoldNotOnPhoneError } from './scaffolds.store';

afterEach(dropTestDatabases);

async function seeded() {
  const database = freshDb();
  await database.scaffolds.put({ ...scaffold, status: 'cleared', version: 4, organisationId: ORG_ID });
  return database;
}

describe('a scaffold’s tag set on the phone', () => {
  it('is written locally with its outbox entry, keeping the version the phone last had from the server', async () => {
    const database = await seeded();
    await changeScaffoldStatus(database, scaffold.id, { status: 'closed', note: 'Ties removed on lift 3' }, new Date('2026-03-02T08:00:00Z'));
    expect(await database.scaffolds.get(scaffold.id)).toMatchObject({ status: 'closed', statusSetAt: '2026-03-02T08:00:00.000Z', version: 4, updatedAt: '2026-03-02T08:00:00.000Z' });
    expect(await listWaitingChanges(database)).toEqual([
      expect.objectContaining({ entity: 'scaffold', action: 'status', entityId: scaffold.id, payload: { status: 'closed', note: 'Ties removed on lift 3' } }),
    ]);
    // The same tag again keeps the time it was set.
    await changeScaffoldStatus(database, scaffold.id, { status: 'closed', note: 'Still closed' }, new Date('2026-03-02T09:00:00Z'));
    expect(await database.scaffolds.get(scaffold.id)).toMatchObject({ status: 'closed', statusSetAt: '2026-03-02T08:00:00.000Z' });
  });

  it('refuses a scaffold that is not on the phone and leaves the outbox empty', async () => {
    const database = freshDb();
    await expect(changeScaffoldStatus(database, scaffold.id, { status: 'closed', note: '' })).rejects.toBeInstanceOf(ScaffoldNotOnPhoneError);
    expect(await database.outbox.count()).toBe(0);
  });

  it('is not overwritten by the feed while it waits, and goes as a mutation based on the local version', async () => {
    const database = await seeded();
    await changeScaffoldStatus(database, scaffold.id, { status: 'limited', note: 'Top lift only' });
    const page: SyncPullResponse = { changes: [{ type: 'scaffold', record: { ...scaffold, status: 'cleared', version: 5 } }], cursor: '1.1', hasMore: false };
    await applyPulledPage(database, page, ORG_ID);
    expect((await database.scaffolds.get(scaffold.id))?.status).toBe('limited');

    const pushes: SyncPush[] = [];
    const transport: SyncTransport = {
      async push(body): Promise<SyncPushResponse> {
        pushes.push(body);
        return { lastMutationId: 1, results: [{ id: 1, outcome: 'applied', reason: null, replayed: false, conflictIds: [] }], records: [] };
      },
      async pull() {
        return { changes: [{ type: 'scaffold', record: { ...scaffold, status: 'limited', version: 6 } }], cursor: '2.1', hasMore: false };
      },
      async send() {},
      async uploadPhoto() {},
    };
    expect(await new SyncEngine(database, transport).sync()).toBe('done');
    expect(pushes[0]!.mutations).toEqual([
      expect.objectContaining({ entity: 'scaffold', action: 'status', entityId: scaffold.id, baseVersion: 4, payload: { status: 'limited', note: 'Top lift only' } }),
    ]);
    // Sent: the feed's copy (the server's stamped tag) replaces the phone's.
    expect(await database.scaffolds.get(scaffold.id)).toMatchObject({ status: 'limited', version: 6 });
  });
});
