import 'fake-indexeddb/auto';
import { DEFAULT_ORGANISATION_SETTINGS } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import type { PhotoRecord } from '../../local-db/records';
import { dropTestDatabases, freshDb, sampleFinding, scaffold, USER_ID } from '../../local-db/testing';
import { assignFinding, handBackFinding, recordFix, recordMadeSafe, recordVerification } from './fix-loop.store';

const FOREMAN = '0b000000-0000-4000-8000-0000000000f1';
const OTHER_INSPECTOR = '0b000000-0000-4000-8000-0000000000a2';
const foreman = { userId: FOREMAN, role: 'foreman' as const };
const inspector = { userId: USER_ID, role: 'inspector' as const };
const now = new Date('2026-03-02T09:00:00.000Z');

function photo(id: string, ownerType: PhotoRecord['ownerType'], ownerId: string): PhotoRecord {
  return { id, ownerType, ownerId, mimeType: 'image/jpeg', data: new ArrayBuffer(8), sizeBytes: 8, width: 4, height: 2, createdAt: now.toISOString() };
}

async function phoneWith(overrides: Parameters<typeof sampleFinding>[0] = {}) {
  const database = freshDb();
  await database.scaffolds.put({ ...scaffold, organisationId: scaffold.siteId, foremanId: null } as never);
  await database.findings.put(sampleFinding({ assigneeId: FOREMAN, ...overrides }));
  return database;
}

const FINDING_ID = sampleFinding().id;

afterEach(dropTestDatabases);

describe('the fix loop on the phone', () => {
  it('records a fix, its record and the command in one go, with the proof photo queued after the command', async () => {
    const database = await phoneWith();
    const fixId = '0a0a0000-0000-4000-8000-000000000001';
    await recordFix(database, FINDING_ID, { note: 'Bagged and lowered', control: 'lower', recordId: fixId, photos: [photo('p-1', 'fix', fixId)] }, foreman, DEFAULT_ORGANISATION_SETTINGS, now);

    expect((await database.findings.get(FINDING_ID))?.state).toBe('fixed');
    expect(await database.fixes.get(fixId)).toEqual({ id: fixId, findingId: FINDING_ID, fixedBy: FOREMAN, fixedAt: now.toISOString(), note: 'Bagged and lowered', control: 'lower', photoIds: ['p-1'] });
    const outbox = await database.outbox.orderBy('id').toArray();
    expect(outbox.map((e) => `${e.entity}:${e.action}`)).toEqual(['finding:state', 'photo:upload']);
    expect(outbox[0]?.payload).toEqual({ to: 'fixed', note: 'Bagged and lowered', control: 'lower', photoIds: ['p-1'], recordId: fixId });
  });

  it('refuses a High fix without a proof photo when the organisation asks for one, and writes nothing', async () => {
    const database = await phoneWith();
    await expect(recordFix(database, FINDING_ID, { note: 'Done', control: 'remove', recordId: 'x', photos: [] }, foreman, DEFAULT_ORGANISATION_SETTINGS, now)).rejects.toThrow(/proof photo/);
    expect((await database.findings.get(FINDING_ID))?.state).toBe('open');
    expect(await database.outbox.count()).toBe(0);
    expect(await database.fixes.count()).toBe(0);

    const relaxed = { ...DEFAULT_ORGANISATION_SETTINGS, proofPhotoRequiredForHigh: false };
    await recordFix(database, FINDING_ID, { note: 'Done', control: 'remove', recordId: '0a0a0000-0000-4000-8000-000000000002', photos: [] }, foreman, relaxed, now);
    expect((await database.findings.get(FINDING_ID))?.state).toBe('fixed');
  });

  it('refuses a foreman a finding that is neither theirs nor on their scaffold', async () => {
    const database = await phoneWith({ assigneeId: null });
    await expect(recordFix(database, FINDING_ID, { note: 'Done', control: 'remove', recordId: 'x', photos: [photo('p', 'fix', 'x')] }, foreman, DEFAULT_ORGANISATION_SETTINGS, now)).rejects.toThrow(/neither assigned to you/);
    await database.scaffolds.update(scaffold.id, { foremanId: FOREMAN });
    await recordFix(database, FINDING_ID, { note: 'Done', control: 'remove', recordId: 'y', photos: [photo('p2', 'fix', 'y')] }, foreman, DEFAULT_ORGANISATION_SETTINGS, now);
    expect((await database.findings.get(FINDING_ID))?.state).toBe('fixed');
  });

  it('does not let whoever marked it fixed verify it, but lets another inspector', async () => {
    const database = await phoneWith({ assigneeId: null });
    await recordFix(database, FINDING_ID, { note: 'Tied on', control: 'tether', recordId: 'fix-1', photos: [photo('p', 'fix', 'fix-1')] }, inspector, DEFAULT_ORGANISATION_SETTINGS, now);
    await expect(recordVerification(database, FINDING_ID, { outcome: 'verified', note: '', recordId: 'v-1', photos: [] }, inspector, DEFAULT_ORGANISATION_SETTINGS, now)).rejects.toThrow(
      'You marked this finding fixed, so someone else must verify it.',
    );
    expect(await database.verifications.count()).toBe(0);

    await recordVerification(database, FINDING_ID, { outcome: 'verified', note: 'Checked', recordId: 'v-2', photos: [] }, { userId: OTHER_INSPECTOR, role: 'inspector' }, DEFAULT_ORGANISATION_SETTINGS, now);
    expect((await database.findings.get(FINDING_ID))?.state).toBe('verified');
    expect((await database.verifications.get('v-2'))?.verifiedBy).toBe(OTHER_INSPECTOR);
  });

  it('reopens only with a reason, which the foreman will read', async () => {
    const database = await phoneWith({ state: 'fixed' });
    await expect(recordVerification(database, FINDING_ID, { outcome: 'reopened', note: ' ', recordId: 'v', photos: [] }, inspector, DEFAULT_ORGANISATION_SETTINGS, now)).rejects.toThrow(/Say why/);
    await recordVerification(database, FINDING_ID, { outcome: 'reopened', note: 'Tether frayed', recordId: 'v', photos: [] }, inspector, DEFAULT_ORGANISATION_SETTINGS, now);
    expect((await database.findings.get(FINDING_ID))?.state).toBe('open');
    expect((await database.outbox.toArray())[0]?.payload).toMatchObject({ to: 'open', note: 'Tether frayed', recordId: 'v' });
  });

  it('records a closed zone with its radius, lapsing at the end of the shift', async () => {
    const database = await phoneWith({ assigneeId: null });
    await recordMadeSafe(database, FINDING_ID, { note: 'Barriers at 6 m', control: 'close-zone', zoneRadiusM: 6, recordId: 'm', photos: [photo('z', 'finding', FINDING_ID)] }, inspector, DEFAULT_ORGANISATION_SETTINGS, now);
    const finding = await database.findings.get(FINDING_ID);
    // 09:00 UTC on 2 March is 09:00 in London (GMT): the shift ends at 17:00 the same day.
    expect(finding).toMatchObject({ state: 'made-safe', madeSafeNote: 'Barriers at 6 m', madeSafeUntil: '2026-03-02T17:00:00.000Z', exposure: 'zone-closed' });
    expect((await database.outbox.orderBy('id').first())?.payload).toEqual({ to: 'made-safe', note: 'Barriers at 6 m', control: 'close-zone', zoneRadiusM: 6, photoIds: ['z'] });
  });

  it('hands a finding back with its reason, and a new assignment clears it', async () => {
    const database = await phoneWith();
    await handBackFinding(database, FINDING_ID, { reason: 'needs-scaffolders', note: 'Brick guard missing' }, foreman, now);
    expect((await database.findings.get(FINDING_ID))?.handBack).toEqual({ reason: 'needs-scaffolders', note: 'Brick guard missing', by: FOREMAN, at: now.toISOString() });
    await assignFinding(database, FINDING_ID, OTHER_INSPECTOR, now);
    expect((await database.findings.get(FINDING_ID))?.handBack).toBeNull();
    const actions = (await database.outbox.orderBy('id').toArray()).map((e) => [e.action, e.payload]);
    expect(actions).toEqual([
      ['hand-back', { reason: 'needs-scaffolders', note: 'Brick guard missing' }],
      ['assign', { assigneeId: OTHER_INSPECTOR, dueAt: null }],
    ]);
  });
});
