import { describe, expect, it } from 'vitest';
import { ORG_ID, sampleFinding, scaffold, site } from '../../local-db/testing';
import { draftReport } from './report-draft';

describe('the report draft', () => {
  const checks = [
    { id: 'c1', organisationId: ORG_ID, inspectionId: 'i', control: 'toe-boards' as const, result: 'fail' as const, note: 'Missing at bay 7', createdAt: '', updatedAt: '', version: 0 },
    { id: 'c2', organisationId: ORG_ID, inspectionId: 'i', control: 'brick-guards' as const, result: 'pass' as const, note: '', createdAt: '', updatedAt: '', version: 0 },
  ];
  const findings = [
    sampleFinding({ item: { catalogueItemId: null, name: 'Brick', massKg: 2.3, shape: null }, lift: 5, bay: 4, heightM: 10 }),
    sampleFinding({ id: 'f-2', item: { catalogueItemId: null, name: 'Coupler', massKg: 1, shape: null }, state: 'made-safe', madeSafeNote: 'Bagged and lowered' }),
  ];

  it('fills every Schedule 7 field from the walk', () => {
    const draft = draftReport({ site: { ...site }, scaffold, findings, checks, user: { name: 'Aileen Marsh', position: 'Scaffold inspector' }, units: 'si' });
    expect(draft.reportFor).toBe('Eastmouth Libraries Trust');
    expect(draft.location).toContain('scaffold QL-A, North and East');
    expect(draft.equipment).toContain('6 lifts of 2 m');
    expect(draft.mattersGivingRisk).toContain('Brick at North, lift 5, bay 4 (10 m up): High risk 16');
    expect(draft.mattersGivingRisk).toContain('Toe boards failed: Missing at bay 7');
    expect(draft.actionTaken).toBe('- Coupler: Bagged and lowered');
    expect(draft.furtherAction).toContain('Secure or remove: Brick');
    expect(draft.furtherAction).not.toContain('Coupler');
    expect(draft.reporterName).toBe('Aileen Marsh');
  });

  it('says so plainly when nothing was found', () => {
    const draft = draftReport({ site: undefined, scaffold, findings: [], checks: [], user: { name: 'A', position: 'B' }, units: 'imperial' });
    expect(draft.mattersGivingRisk).toMatch(/No matters/);
    expect(draft.furtherAction).toBe('None.');
    expect(draft.equipment).toContain('6.56 ft');
  });
});
