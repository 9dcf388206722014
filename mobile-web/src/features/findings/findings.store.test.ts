import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import { listWaitingChanges } from '../../local-db/outbox';
import type { PhotoRecord } from '../../local-db/records';
import { dropTestDatabases, freshDb, ORG_ID, SCAFFOLD_ID, SITE_ID, USER_ID } from '../../local-db/testing';
import { newFindingForm, readFindingForm, type FindingForm } from './finding-form';
import { buildFindingRecord, tryEstimate, type FindingOwner } from './finding-record';
import { findingsOfScaffold, getFinding, saveFinding } from './findings.store';

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
    expect(entries[1]!.payload).toEqual({ to: 'made-safe', note: 'Bagged and lowered' });
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
});
