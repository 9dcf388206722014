import 'fake-indexeddb/auto';
import { CONTROLS, type InspectionFinish } from '@plummet/shared';
import { afterEach, describe, expect, it } from 'vitest';
import { listWaitingChanges } from '../../local-db/outbox';
import { dropTestDatabases, freshDb, ORG_ID, scaffold, site, USER_ID } from '../../local-db/testing';
import { controlChecksOf, finishInspection, inspectionInProgress, recordControlCheck, startInspection } from './inspections.store';

afterEach(dropTestDatabases);

const report: InspectionFinish = {
  reportFor: 'Eastmouth Libraries Trust',
  location: 'Quayside Library, scaffold QL-A',
  equipment: 'Independent scaffold, 6 lifts',
  mattersGivingRisk: 'Loose fittings on lift 5',
  actionTaken: 'Fittings bagged',
  furtherAction: 'None',
  reporterName: 'Aileen Marsh',
  reporterPosition: 'Scaffold inspector',
  signature: null,
  tagStatus: 'limited',
  restriction: 'Lifts 1–4 only',
  accessTagsChanged: true,
};

async function seeded() {
  const database = freshDb();
  await database.sites.put({ ...site, organisationId: ORG_ID, offline: true });
  await database.scaffolds.put({ ...scaffold, organisationId: ORG_ID });
  const inspection = await startInspection(database, { scaffold: { ...scaffold, organisationId: ORG_ID }, inspectorId: USER_ID, reason: 'scheduled', windSpeedMps: 6 }, new Date('2026-03-02T08:00:00Z'));
  return { database, inspection };
}

describe('an inspection on the phone', () => {
  it('starts with its create entry in the outbox', async () => {
    const { database, inspection } = await seeded();
    expect(await inspectionInProgress(database, scaffold.id)).toMatchObject({ id: inspection.id, windSpeedMps: 6, status: 'in-progress' });
    const [entry] = await listWaitingChanges(database);
    expect(entry).toMatchObject({ entity: 'inspection', action: 'create', payload: { id: inspection.id, scaffoldId: scaffold.id, reason: 'scheduled', windSpeedMps: 6 } });
  });

  it('records each control check once, the last answer winning', async () => {
    const { database, inspection } = await seeded();
    const answer = { inspectionId: inspection.id, organisationId: ORG_ID, control: 'toe-boards' as const, result: 'pass' as const, note: '' };
    const first = await recordControlCheck(database, answer);
    const second = await recordControlCheck(database, { ...answer, result: 'fail', note: 'Missing at bay 7' });

    expect(second.id).toBe(first.id);
    expect(await controlChecksOf(database, inspection.id)).toHaveLength(1);
    const checks = (await listWaitingChanges(database)).filter((entry) => entry.entity === 'control-check');
    expect(checks).toHaveLength(1);
    expect(checks[0]!.payload).toMatchObject({ control: 'toe-boards', result: 'fail', note: 'Missing at bay 7' });
  });

  it('refuses to finish before every control is answered', async () => {
    const { database, inspection } = await seeded();
    await expect(finishInspection(database, inspection.id, report)).rejects.toThrow(/10 left/);
  });

  it('finishes with the report, queues the finish and moves the scaffold’s due date on (7-day regime)', async () => {
    const { database, inspection } = await seeded();
    for (const control of CONTROLS) {
      await recordControlCheck(database, { inspectionId: inspection.id, organisationId: ORG_ID, control, result: 'pass', note: '' });
    }
    const finished = await finishInspection(database, inspection.id, { ...report, finishedAt: '2026-03-02T10:00:00.000Z' });

    expect(finished).toMatchObject({ status: 'finished', reporterName: 'Aileen Marsh', finishedAt: '2026-03-02T10:00:00.000Z' });
    const stored = await database.scaffolds.get(scaffold.id);
    expect(stored?.lastInspectedAt).toBe('2026-03-02T10:00:00.000Z');
    expect(stored?.nextDueAt).toBe('2026-03-09T10:00:00.000Z'); // UK WAHR 2005 reg. 12: every 7 days
    expect(stored?.status).toBe('limited'); // the tag status the inspector recorded
    const entries = await listWaitingChanges(database);
    expect(entries.at(-1)).toMatchObject({ entity: 'inspection', action: 'finish', payload: { reportFor: 'Eastmouth Libraries Trust', tagStatus: 'limited', restriction: 'Lifts 1–4 only', accessTagsChanged: true } });
    await expect(finishInspection(database, inspection.id, report)).rejects.toThrow(/already finished/);
  });
});
