import { readOrganisationSettings } from '@plummet/shared';
import { describe, expect, it } from 'vitest';
import type { ReportData } from './report-data.js';
import { schedule7Fields } from './schedule7.js';

/** Only the columns the Schedule 7 particulars read; the rest of each row does not matter here. */
function report(inspection: { location: string; equipment: string }): ReportData {
  return {
    inspection: { reportFor: 'Eastmouth Libraries Trust', mattersGivingRisk: '', actionTaken: '', furtherAction: '', reporterName: 'A. Marsh', reporterPosition: 'Inspector', startedAt: new Date('2026-03-02T09:00:00Z'), finishedAt: new Date('2026-03-02T10:00:00Z'), ...inspection },
    site: { name: 'Quayside Library', address: '14 Wharfinger Lane', clientName: '', clientAddress: 'Civic Hall' },
    scaffold: { reference: 'QL-A', description: 'Independent scaffold with brick guards' },
    organisation: { id: 'o', name: 'Org', settings: readOrganisationSettings({}) },
    inspector: { id: 'u', name: 'A. Marsh', email: 'a@x.test', position: 'Inspector' },
    controlChecks: [],
    findings: [],
  } as unknown as ReportData;
}

const field = (data: ReportData, number: string) => schedule7Fields(data).find(([label]) => label.startsWith(number))![1];

describe('the Schedule 7 particulars of a report (UK WAHR 2005, Schedule 7)', () => {
  it('names the site and scaffold once when the inspector’s text already names them', () => {
    const data = report({ location: 'Quayside Library, 14 Wharfinger Lane: scaffold QL-A, North', equipment: 'Independent scaffold with brick guards; 6 lifts of 2 m' });
    expect(field(data, '2.')).toBe('Quayside Library, 14 Wharfinger Lane: scaffold QL-A, North');
    expect(field(data, '3.')).toBe('Scaffold QL-A: Independent scaffold with brick guards; 6 lifts of 2 m');
  });

  it('adds the site and scaffold where the inspector’s text leaves them out', () => {
    const data = report({ location: 'North elevation', equipment: '6 lifts' });
    expect(field(data, '2.')).toBe('Quayside Library, 14 Wharfinger Lane, North elevation');
    expect(field(data, '3.')).toBe('Scaffold QL-A: Independent scaffold with brick guards: 6 lifts');
  });
});
