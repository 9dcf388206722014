import 'fake-indexeddb/auto';
import { afterEach, describe, expect, it } from 'vitest';
import type { SignedReportRecord } from './records';
import { keepSignedReport } from './signed-reports';
import { dropTestDatabases, freshDb, ORG_ID } from './testing';

afterEach(dropTestDatabases);

const report = (id: string, finishedAt: string, checks = 0): SignedReportRecord =>
  ({
    id,
    scaffoldId: 'scaffold-1',
    organisationId: ORG_ID,
    finishedAt,
    tagStatus: 'limited',
    controlChecks: Array.from({ length: checks }, (_, i) => ({ id: `c${i}`, control: 'toe-boards', result: 'pass' })),
  }) as unknown as SignedReportRecord;

describe('the last signed report of a scaffold on the phone', () => {
  it('keeps the latest signature only, and the control checks of the same report when a copy comes without them', async () => {
    const database = freshDb();
    expect(await keepSignedReport(database, report('a', '2026-03-02T10:00:00Z', 3))).toBe(true);
    expect(await keepSignedReport(database, report('old', '2026-02-20T10:00:00Z'))).toBe(false);
    expect((await database.signedReports.get('scaffold-1'))?.id).toBe('a');
    await keepSignedReport(database, report('a', '2026-03-02T10:00:00Z'));
    expect((await database.signedReports.get('scaffold-1'))?.controlChecks).toHaveLength(3);
    await keepSignedReport(database, report('b', '2026-03-09T10:00:00Z', 1));
    expect((await database.signedReports.get('scaffold-1'))?.id).toBe('b');
  });
});
