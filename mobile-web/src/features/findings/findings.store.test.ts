import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { listWaitingChanges } from '../../local-db/outbox';
import type { PhotoRecord } from '../../local-db/records';
import { dropTestDatabases, freshDb, ORG_ID, SCAFFOLD_ID, SITE_ID, USER_ID } from '../../local-db/testing';
import { newFindingForm, readFindingForm, type FindingForm } from './finding-form';
import { buildFindingRecord, tryEstimate, type FindingOwner } from './finding-record';
import { changeFindingState, findingsOfScaffold, getFinding, markFindingFixed, markFindingVerified, reopenFinding, saveFinding } from './findings.store';

afterEach(dropTestDatabases);

const owner: FindingOwner = {
  id: '0f000000-0000-4000-8000-000000000001',
  organisationId: ORG_ID,
  siteId: SITE_ID,
  scaffoldId: SCAFFOLD_ID,
  inspectionId: '0e000000-0000-4000-8000-000000000001',
  createdBy: USER_ID,
};

const context = { units: 'si' as const, liftHeightM: 2, windSpeedMps: 6 };

function customBrick(overrides: Partial<FindingForm> = {}): FindingForm {
  return {
    ...newFindingForm({ elevation: 'North', lift: 5, bay: 4 }, 6),
    itemMode: 'custom',
    customName: 'Brick',
    massText: '2.3',
    shape: 'box',
    dimensionTexts: { lengthM: '21.5', widthM: '10.25', heightM: '6.5' },
    exposure: 'public',
    ...overrides,
  };
}

function recordOf(form: FindingForm, previous?: Parameters<typeof buildFindingRecord>[5]) {
  const reading = readFindingForm(form, context);
  const { result } = tryEstimate(reading.input);
  if (!reading.item || !reading.input || !result) throw new Error('form incomplete');
  return buildFindingRecord(owner, form, reading.item, reading.input, result, previous, new Date('2026-03-01T09:00:00Z'));
}

function photo(id: string): PhotoRecord {
  return {
    id,
    ownerType: 'finding',
    ownerId: owner.id,
    mimeType: 'image/jpeg',
    data: new Blob([new Uint8Array([0xff, 0xd8, 0xff, 0xd9])], { type: 'image/jpeg' }),
    sizeBytes: 4,
    width: 1,
    height: 1,
    createdAt: '2026-03-01T09:00:00.000Z',
  };
}

describe('saving a finding', () => {
  it('stores the finding with its estimate, its photos and their outbox entries together', async () => {
    const database = freshDb();
    const finding = recordOf(customBrick());
    await saveFinding(database, finding, [photo('0a0a0000-0000-4000-8000-000000000001')]);

    const stored = await getFinding(database, owner.id);
    expect(stored?.heightM).toBe(10); // lift 5 × 2 m
    expect(stored?.estimate.impactEnergyJ).toBeGreaterThan(200);
    expect(stored?.riskBand).toBe(finding.riskBand);
    expect(await database.photos.count()).toBe(1);
    const entries = await listWaitingChanges(database);
    expect(entries.map((entry) => `${entry.entity}:${entry.action}`)).toEqual(['finding:create', 'photo:upload']);
    expect(entries[0]!.payload).toMatchObject({ id: owner.id, heightM: 10, item: { name: 'Brick', massKg: 2.3 } });
  });

  it('keeps nothing when a part of the save fails', async () => {
    const database = freshDb();
    const duplicate = photo('0a0a0000-0000-4000-8000-000000000002');
    await database.photos.add(duplicate);
    await expect(saveFinding(database, recordOf(customBrick()), [duplicate])).rejects.toThrow();
    expect(await database.findings.count()).toBe(0);
    expect(await database.outbox.count()).toBe(0);
  });

  it('queues "made safe now" as a state change with its note after the create', async () => {
    const database = freshDb();
    await saveFinding(database, recordOf(customBrick({ madeSafe: true, madeSafeNote: 'Bagged and lowered' })));

    expect((await getFinding(database, owner.id))?.state).toBe('made-safe');
    const entries = await listWaitingChanges(database);
    expect(entries.map((entry) => entry.action)).toEqual(['create', 'state']);
    expect(entries[1]!.payload).toEqual({ to: 'made-safe', note: 'Bagged and lowered', photoIds: [] });
  });

  it("sends the finding's photos as the proof of a measure taken while recording it", async () => {
    const database = freshDb();
    const finding = recordOf(customBrick({ madeSafe: true, madeSafeNote: 'Bagged and lowered' }));
    const photo = { id: '0c000000-0000-4000-8000-0000000000a1', ownerType: 'finding' as const, ownerId: finding.id, mimeType: 'image/jpeg', data: new ArrayBuffer(4), sizeBytes: 4, width: 2, height: 2, createdAt: '2026-03-01T08:00:00.000Z' };
    await saveFinding(database, finding, [photo]);
    const entries = await listWaitingChanges(database);
    expect(entries.find((entry) => entry.action === 'state')!.payload).toMatchObject({ to: 'made-safe', photoIds: [photo.id] });
  });

  it('folds a later edit into the waiting create and recomputes the estimate', async () => {
    const database = freshDb();
    const first = recordOf(customBrick());
    await saveFinding(database, first);
    const edited = recordOf(customBrick({ heightMode: 'measured', heightText: '3' }), first);
    await saveFinding(database, edited);

    const stored = await getFinding(database, owner.id);
    expect(stored?.heightM).toBe(3);
    expect(stored!.estimate.impactEnergyJ).toBeLessThan(first.estimate.impactEnergyJ);
    const entries = await listWaitingChanges(database);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ action: 'create', payload: { heightM: 3 } });
  });

  it('lists a scaffold’s findings highest risk first', async () => {
    const database = freshDb();
    const low = recordOf(customBrick({ exposure: 'zone-closed', answers: { securing: 'secured', edgeDistance: 'away', activity: 'none', wind: 'calm', footTraffic: 'none' } }));
    const high = { ...recordOf(customBrick({ answers: { securing: 'loose', edgeDistance: 'at-edge', activity: 'heavy', wind: 'strong', footTraffic: 'frequent' } })), id: '0f000000-0000-4000-8000-000000000002' };
    await saveFinding(database, low);
    await saveFinding(database, high);
    expect((await findingsOfScaffold(database, SCAFFOLD_ID)).map((f) => f.id)).toEqual([high.id, low.id]);
    expect(high.riskScore).toBeGreaterThan(low.riskScore);
  });

  it('sends only the fields an edit changed, from the version it started from, so other phones’ edits of other fields survive', async () => {
    const database = freshDb();
    const synced = { ...recordOf(customBrick()), version: 3 };
    await database.findings.put(synced);

    await saveFinding(database, recordOf(customBrick({ notes: 'Wedged behind the toe board' }), synced));
    const entries = await listWaitingChanges(database);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ action: 'update', attempts: 0 });
    expect(entries[0]!.payload).toEqual({ notes: 'Wedged behind the toe board', version: 3 });
  });

  it('queues nothing when a save changes no field', async () => {
    const database = freshDb();
    const synced = { ...recordOf(customBrick()), version: 2 };
    await database.findings.put(synced);
    await saveFinding(database, recordOf(customBrick(), synced));
    expect(await database.outbox.count()).toBe(0);
  });

  it('never folds an edit into one the sync has already tried: the later edit waits as its own entry with its own fields', async () => {
    const database = freshDb();
    const synced = { ...recordOf(customBrick()), version: 3 };
    await database.findings.put(synced);
    const notes = recordOf(customBrick({ notes: 'first' }), synced);
    await saveFinding(database, notes);
    const [sent] = await listWaitingChanges(database);
    await database.outbox.update(sent!.id!, { attempts: 1 }); // what the engine does before it first sends an entry

    await saveFinding(database, recordOf(customBrick({ notes: 'first', exposure: 'hard-hats' }), notes));
    const entries = await listWaitingChanges(database);
    expect(entries.map((entry) => entry.payload)).toEqual([
      { notes: 'first', version: 3 },
      { exposure: 'hard-hats', version: 3 },
    ]);
  });

  it('queues fixed, verified and reopened as state commands the state machine allows, and refuses the others', async () => {
    const database = freshDb();
    await database.findings.put({ ...recordOf(customBrick()), version: 4 });

    await expect(markFindingVerified(database, owner.id, 'inspector')).rejects.toThrow(/cannot move from open to verified/);
    await markFindingFixed(database, owner.id, 'foreman', 'Removed', true);
    await expect(reopenFinding(database, owner.id, 'foreman')).rejects.toThrow(/role/);
    await markFindingVerified(database, owner.id, 'inspector', 'Checked');
    await reopenFinding(database, owner.id, 'manager', 'Back again');
    await changeFindingState(database, owner.id, { to: 'open', role: 'inspector' }); // already open: nothing queued

    expect((await getFinding(database, owner.id))?.state).toBe('open');
    const entries = await listWaitingChanges(database);
    expect(entries.map((entry) => [entry.action, (entry.payload as { to: string; note: string }).to, (entry.payload as { note: string }).note])).toEqual([
      ['state', 'fixed', 'Removed'],
      ['state', 'verified', 'Checked'],
      ['state', 'open', 'Back again'],
    ]);
    expect(entries.every((entry) => typeof (entry.payload as { recordId?: string }).recordId === 'string')).toBe(true);
  });
});
