import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { countWaitingChanges, enqueueChange, idsWithWaitingChanges, listWaitingChanges } from './outbox';
import { dropTestDatabases, freshDb, SCAFFOLD_ID } from './testing';

afterEach(dropTestDatabases);

const findingId = '0f000000-0000-4000-8000-000000000001';
const create = {
  entity: 'finding',
  action: 'create',
  payload: {
    id: findingId,
    scaffoldId: SCAFFOLD_ID,
    inspectionId: null,
    elevation: 'North',
    lift: 3,
    bay: 4,
    heightM: 6,
    item: { name: 'Brick', massKg: 2.3 },
    exposure: 'public',
    likelihoodAnswers: { securing: 'loose', edgeDistance: 'at-edge', activity: 'light', wind: 'calm', footTraffic: 'frequent' },
    notes: '',
  },
} as const;

describe('the outbox', () => {
  it('keeps changes in the order they were made and counts them for the badge', async () => {
    const database = freshDb();
    await enqueueChange(database, findingId, create);
    await enqueueChange(database, findingId, { entity: 'finding', action: 'state', payload: { to: 'made-safe', note: 'Bagged' } });
    await enqueueChange(database, 'p-1', { entity: 'photo', action: 'upload', payload: { id: 'p-1', ownerType: 'finding', ownerId: findingId } });

    expect(await countWaitingChanges(database)).toBe(3);
    expect((await listWaitingChanges(database)).map((entry) => entry.action)).toEqual(['create', 'state', 'upload']);
  });

  it('folds an edit into the create that still waits, so the finding is sent once', async () => {
    const database = freshDb();
    await enqueueChange(database, findingId, create);
    await enqueueChange(database, findingId, { entity: 'finding', action: 'update', payload: { heightM: 8, notes: 'Moved', version: 3 } });

    const entries = await listWaitingChanges(database);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ action: 'create', payload: { heightM: 8, notes: 'Moved', lift: 3 } });
    expect(entries[0]!.payload).not.toHaveProperty('version');
  });

  it('folds successive edits of a server finding into one update that keeps the first version', async () => {
    const database = freshDb();
    await enqueueChange(database, findingId, { entity: 'finding', action: 'update', payload: { notes: 'a', version: 4 } });
    await enqueueChange(database, findingId, { entity: 'finding', action: 'update', payload: { heightM: 9, version: 4 } });

    const entries = await listWaitingChanges(database);
    expect(entries).toHaveLength(1);
    expect(entries[0]!.payload).toEqual({ notes: 'a', heightM: 9, version: 4 });
  });

  it('leaves an entry the sync has already tried alone and queues the edit after it', async () => {
    const database = freshDb();
    const id = await enqueueChange(database, findingId, create);
    await database.outbox.update(id, { attempts: 1 });
    await enqueueChange(database, findingId, { entity: 'finding', action: 'update', payload: { notes: 'later' } });

    expect((await listWaitingChanges(database)).map((entry) => entry.action)).toEqual(['create', 'update']);
  });

  it('replaces a waiting control-check answer instead of queueing a second one', async () => {
    const database = freshDb();
    const payload = { inspectionId: 'i-1', control: 'toe-boards', result: 'pass', note: '' } as const;
    await enqueueChange(database, 'cc-1', { entity: 'control-check', action: 'put', payload });
    await enqueueChange(database, 'cc-1', { entity: 'control-check', action: 'put', payload: { ...payload, result: 'fail', note: 'Missing at bay 7' } });

    const entries = await listWaitingChanges(database);
    expect(entries).toHaveLength(1);
    expect(entries[0]!.payload).toMatchObject({ result: 'fail', note: 'Missing at bay 7' });
  });

  it('never folds a second inspection change into its create', async () => {
    const database = freshDb();
    await enqueueChange(database, 'i-1', { entity: 'inspection', action: 'create', payload: { id: 'i-1', scaffoldId: SCAFFOLD_ID, reason: 'scheduled', windSpeedMps: null } });
    await enqueueChange(database, 'i-1', { entity: 'inspection', action: 'update', payload: { reportFor: 'Client' } });
    expect(await countWaitingChanges(database)).toBe(2);
  });

  it('lists the records that have changes waiting, per entity', async () => {
    const database = freshDb();
    await enqueueChange(database, findingId, create);
    await enqueueChange(database, 'p-1', { entity: 'photo', action: 'upload', payload: { id: 'p-1', ownerType: 'finding', ownerId: findingId } });
    expect([...(await idsWithWaitingChanges(database, 'finding'))]).toEqual([findingId]);
  });
});
