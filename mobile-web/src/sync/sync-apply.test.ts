import 'fake-indexeddb/auto';
import type { SyncChange, SyncPullResponse } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { PlummetDb, readMeta } from '../local-db/db';
import { enqueueChange } from '../local-db/outbox';
import { dropTestDatabases, freshDb, inspector, openVersion1Database, ORG_ID, sampleFinding, scaffold, SCAFFOLD_ID, site, SITE_ID } from '../local-db/testing';
import { applyPulledPage } from './sync-apply';
import { SYNC_META } from './sync-state';

afterEach(dropTestDatabases);

const T = '2026-03-02T08:00:00.000Z';
const INSPECTION_ID = '0e000000-0000-4000-8000-000000000001';
const FINDING_ID = '0f000000-0000-4000-8000-000000000001';
const OTHER_FINDING_ID = '0f000000-0000-4000-8000-000000000002';
const FIX_ID = '10000000-0000-4000-8000-000000000001';

const page = (changes: SyncChange[], cursor = '5.1'): SyncPullResponse => ({ changes, cursor, hasMore: false });

function serverFinding(id: string, notes = '') {
  const { organisationId: _o, ...rest } = sampleFinding({ id, inspectionId: INSPECTION_ID, notes });
  return { ...rest, organisationId: ORG_ID, siteId: SITE_ID };
}

/** One of each record type a phone holds, as the feed carries them. */
const everything: SyncChange[] = [
  { type: 'user', record: inspector },
  { type: 'site', record: site },
  { type: 'scaffold', record: scaffold },
  {
    type: 'inspection',
    record: {
      id: INSPECTION_ID,
      scaffoldId: SCAFFOLD_ID,
      inspectorId: inspector.id,
      startedAt: T,
      finishedAt: null,
      reason: 'scheduled',
      windSpeedMps: 3,
      reportFor: '',
      location: '',
      equipment: '',
      mattersGivingRisk: '',
      actionTaken: '',
      furtherAction: '',
      reporterName: '',
      reporterPosition: '',
      signature: null,
      signedAt: null,
      createdAt: T,
      updatedAt: T,
      version: 1,
    },
  },
  {
    type: 'control-check',
    record: { id: '11000000-0000-4000-8000-000000000001', inspectionId: INSPECTION_ID, control: 'toe-boards', result: 'pass', note: '', createdAt: T, updatedAt: T, version: 1 },
  },
  { type: 'finding', record: serverFinding(FINDING_ID) },
  { type: 'finding', record: serverFinding(OTHER_FINDING_ID) },
  { type: 'fix', record: { id: FIX_ID, findingId: FINDING_ID, fixedBy: inspector.id, fixedAt: T, note: 'Tethered', control: null, photoIds: [] } },
  {
    type: 'verification',
    record: { id: '12000000-0000-4000-8000-000000000001', findingId: FINDING_ID, verifiedBy: inspector.id, verifiedAt: T, outcome: 'verified', note: '', photoIds: [] },
  },
  {
    type: 'photo',
    record: {
      id: '13000000-0000-4000-8000-000000000001',
      ownerType: 'finding',
      ownerId: FINDING_ID,
      contentHash: 'a'.repeat(64),
      sizeBytes: 1000,
      mediaType: 'image/jpeg',
      width: 10,
      height: 10,
      takenAt: null,
      uploadedBy: inspector.id,
      createdAt: T,
      url: '/api/photos/13000000-0000-4000-8000-000000000001',
      thumbnailUrl: '/api/photos/13000000-0000-4000-8000-000000000001/thumbnail',
    },
  },
  {
    type: 'catalogue-item',
    record: { id: '14000000-0000-4000-8000-000000000001', name: 'Spirit level', category: 'tool', massKg: 0.6, shape: null, source: 'Weighed', builtIn: false, createdAt: T, updatedAt: T, version: 1 },
  },
] as SyncChange[];

describe('applying a pulled page', () => {
  it('stores every record type the feed carries, and the cursor', async () => {
    const database = freshDb();
    await database.inspections.put({ ...(everything[3]!.record as object), siteId: '', status: 'in-progress', organisationId: ORG_ID } as never);
    await applyPulledPage(database, page(everything));
    expect(await database.sites.get(SITE_ID)).toMatchObject({ name: site.name, organisationId: ORG_ID });
    expect(await database.scaffolds.get(SCAFFOLD_ID)).toMatchObject({ reference: scaffold.reference, organisationId: ORG_ID });
    expect(await database.inspections.get(INSPECTION_ID)).toMatchObject({ siteId: SITE_ID, status: 'in-progress' });
    expect(await database.controlChecks.where('inspectionId').equals(INSPECTION_ID).count()).toBe(1);
    expect(await database.findings.count()).toBe(2);
    expect(await database.fixes.get(FIX_ID)).toMatchObject({ note: 'Tethered' });
    expect(await database.verifications.count()).toBe(1);
    expect(await database.photoMeta.count()).toBe(1);
    expect((await database.catalogue.get('14000000-0000-4000-8000-000000000001'))?.words).toContain('spirit');
    expect(await readMeta(database, SYNC_META.profile)).toEqual(inspector);
    expect(await readMeta(database, SYNC_META.cursor)).toBe('5.1');
  });

  it('stores a pulled signed inspection and the user’s own walk, but not another inspector’s walk still under way', async () => {
    const database = freshDb();
    const walk = everything[3]!.record as { id: string; inspectorId: string };
    const signed = { ...walk, id: '0e000000-0000-4000-8000-000000000002', inspectorId: '0a000000-0000-4000-8000-0000000000ff', finishedAt: T, signedAt: T, signature: 'data:image/png;base64,AA==' };
    const othersWalk = { ...walk, id: '0e000000-0000-4000-8000-000000000003', inspectorId: '0a000000-0000-4000-8000-0000000000ff' };
    await applyPulledPage(database, page([...everything.slice(0, 3), { type: 'inspection', record: walk }, { type: 'inspection', record: signed }, { type: 'inspection', record: othersWalk }] as SyncChange[]));
    expect(await database.inspections.get(walk.id)).toMatchObject({ status: 'in-progress', siteId: SITE_ID });
    expect(await database.inspections.get(signed.id)).toMatchObject({ status: 'finished', siteId: SITE_ID });
    expect(await database.inspections.get(othersWalk.id)).toBeUndefined();
    // Once signed, that walk comes too.
    await applyPulledPage(database, page([{ type: 'inspection', record: { ...othersWalk, finishedAt: T, signedAt: T, version: 2 } }] as SyncChange[], '6.1'));
    expect(await database.inspections.get(othersWalk.id)).toMatchObject({ status: 'finished' });
  });

  it('keeps a site made available offline marked so when the feed brings it again', async () => {
    const database = freshDb();
    await database.sites.put({ ...site, organisationId: ORG_ID, offline: true, downloadedAt: T });
    await applyPulledPage(database, page([{ type: 'site', record: { ...site, name: 'Renamed', version: 2 } }]));
    expect(await database.sites.get(SITE_ID)).toMatchObject({ name: 'Renamed', offline: true, downloadedAt: T });
  });

  it('drops an archived scaffold with its findings, fixes, inspections and checks, and leaves the site', async () => {
    const database = freshDb();
    await database.inspections.put({ ...(everything[3]!.record as object), siteId: '', status: 'in-progress', organisationId: ORG_ID } as never);
    await applyPulledPage(database, page(everything));
    await applyPulledPage(database, page([{ type: 'tombstone', record: { recordType: 'scaffold', id: SCAFFOLD_ID, reason: 'archived' } }], '6.1'));
    expect(await database.scaffolds.count()).toBe(0);
    expect(await database.findings.count()).toBe(0);
    expect(await database.fixes.count()).toBe(0);
    expect(await database.verifications.count()).toBe(0);
    expect(await database.photoMeta.count()).toBe(0);
    expect(await database.inspections.count()).toBe(0);
    expect(await database.controlChecks.count()).toBe(0);
    expect(await database.sites.count()).toBe(1);
  });

  it('drops a finding that left the caller’s scope, but keeps one whose local edits still wait to be sent', async () => {
    const database = freshDb();
    await applyPulledPage(database, page(everything));
    await enqueueChange(database, OTHER_FINDING_ID, { entity: 'finding', action: 'update', payload: { notes: 'edited offline' } });
    await applyPulledPage(
      database,
      page([
        { type: 'tombstone', record: { recordType: 'finding', id: FINDING_ID, reason: 'out-of-scope' } },
        { type: 'tombstone', record: { recordType: 'finding', id: OTHER_FINDING_ID, reason: 'out-of-scope' } },
      ]),
    );
    expect(await database.findings.get(FINDING_ID)).toBeUndefined();
    expect(await database.fixes.get(FIX_ID)).toBeUndefined();
    expect(await database.findings.get(OTHER_FINDING_ID)).toBeDefined();
  });
});

describe('the phone database upgrade', () => {
  it('keeps what version 1 held and adds the tables for fixes, verifications and photo metadata', async () => {
    const name = `plummet-upgrade-${crypto.randomUUID()}`;
    const v1 = openVersion1Database(name);
    await v1.table('sites').put({ ...site, organisationId: ORG_ID });
    v1.close();
    const upgraded = new PlummetDb(name);
    try {
      expect(await upgraded.sites.get(SITE_ID)).toMatchObject({ name: site.name });
      await upgraded.fixes.put(everything.find((c) => c.type === 'fix')!.record as never);
      expect(await upgraded.fixes.where('findingId').equals(FINDING_ID).count()).toBe(1);
    } finally {
      await upgraded.delete();
    }
  });
});
