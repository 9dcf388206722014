import { DEFAULT_ORGANISATION_SETTINGS, describeDue } from '@plummet/shared';
import { describe, expect, it } from 'vitest';
import type { ScaffoldRecord } from '../../local-db/records';
import { sampleFinding, scaffold } from '../../local-db/testing';
import { buildFixList, buildToVerify, dueAtOf } from './fix-loop-rules';

const FOREMAN = 'foreman-1';
const now = new Date('2026-03-02T12:00:00.000Z');
const mine: ScaffoldRecord = { ...scaffold, organisationId: 'org', foremanId: FOREMAN, nextDueAt: '2026-03-05T10:00:00.000Z' };
const theirs: ScaffoldRecord = { ...scaffold, id: 'other-scaffold', organisationId: 'org', foremanId: 'someone-else' };
const scaffolds = new Map([mine, theirs].map((s) => [s.id, s]));

describe('the fix list and the to-verify list', () => {
  it('computes due times from the band and the organisation’s hours (common practice, no source: High 24 h, Medium 72 h, Low at the next inspection)', () => {
    const raised = '2026-03-01T12:00:00.000Z';
    expect(dueAtOf(sampleFinding({ riskBand: 'High', createdAt: raised }), mine, DEFAULT_ORGANISATION_SETTINGS)?.toISOString()).toBe('2026-03-02T12:00:00.000Z');
    expect(dueAtOf(sampleFinding({ riskBand: 'Medium', createdAt: raised }), mine, DEFAULT_ORGANISATION_SETTINGS)?.toISOString()).toBe('2026-03-04T12:00:00.000Z');
    expect(dueAtOf(sampleFinding({ riskBand: 'Low', createdAt: raised }), mine, DEFAULT_ORGANISATION_SETTINGS)?.toISOString()).toBe('2026-03-05T10:00:00.000Z');
    const shorter = { ...DEFAULT_ORGANISATION_SETTINGS, fixDueHours: { High: 4, Medium: 8 } };
    expect(dueAtOf(sampleFinding({ riskBand: 'High', createdAt: raised }), mine, shorter)?.toISOString()).toBe('2026-03-01T16:00:00.000Z');
    expect(dueAtOf(sampleFinding({ dueAt: '2026-03-09T00:00:00.000Z' }), mine, shorter)?.toISOString()).toBe('2026-03-09T00:00:00.000Z');
  });

  it('shows lateness in words, not by colour alone', () => {
    expect(describeDue(new Date('2026-03-02T15:00:00.000Z'), now)).toEqual({ words: 'due in 3 h', overdue: false });
    expect(describeDue(new Date('2026-02-28T12:00:00.000Z'), now)).toEqual({ words: 'overdue by 2 days', overdue: true });
  });

  it('holds what is assigned to the foreman or unassigned on their scaffolds, by band, then due time, then height', () => {
    const findings = [
      sampleFinding({ id: 'low', riskBand: 'Low', assigneeId: null }),
      sampleFinding({ id: 'high-later', riskBand: 'High', assigneeId: FOREMAN, dueAt: '2026-03-03T12:00:00.000Z', heightM: 10 }),
      sampleFinding({ id: 'high-sooner-low', riskBand: 'High', assigneeId: FOREMAN, dueAt: '2026-03-02T11:00:00.000Z', heightM: 2 }),
      sampleFinding({ id: 'high-sooner-high', riskBand: 'High', assigneeId: null, dueAt: '2026-03-02T11:00:00.000Z', heightM: 8 }),
      sampleFinding({ id: 'medium', riskBand: 'Medium', assigneeId: FOREMAN, scaffoldId: theirs.id }),
      sampleFinding({ id: 'someone-elses', assigneeId: 'foreman-2' }),
      sampleFinding({ id: 'not-mine-unassigned', assigneeId: null, scaffoldId: theirs.id }),
      sampleFinding({ id: 'fixed', assigneeId: FOREMAN, state: 'fixed' }),
      sampleFinding({ id: 'handed-back', assigneeId: FOREMAN, handBack: { reason: 'not-my-area', note: '', by: FOREMAN, at: now.toISOString() } }),
    ];
    const list = buildFixList(findings, scaffolds, FOREMAN, DEFAULT_ORGANISATION_SETTINGS, now);
    expect(list.map((e) => e.finding.id)).toEqual(['high-sooner-high', 'high-sooner-low', 'high-later', 'medium', 'low']);
    expect(list[0]?.due).toEqual({ words: 'overdue by 1 h', overdue: true });
    // Medium was raised on 1 February: 72 hours later it was due, long ago.
    expect(list.filter((e) => e.due.overdue).map((e) => e.finding.id)).toEqual(['high-sooner-high', 'high-sooner-low', 'medium']);
  });

  it('lists fixed findings to verify by band, then the oldest fix first', () => {
    const fix = (findingId: string, fixedAt: string) => ({ id: `fix-${findingId}`, findingId, fixedBy: FOREMAN, fixedAt, note: '', control: null, photoIds: [] });
    const list = buildToVerify(
      [
        sampleFinding({ id: 'medium-old', riskBand: 'Medium', state: 'fixed' }),
        sampleFinding({ id: 'high-new', riskBand: 'High', state: 'fixed' }),
        sampleFinding({ id: 'high-old', riskBand: 'High', state: 'fixed' }),
        sampleFinding({ id: 'open', riskBand: 'High', state: 'open' }),
      ],
      [fix('medium-old', '2026-03-01T08:00:00.000Z'), fix('high-new', '2026-03-02T08:00:00.000Z'), fix('high-old', '2026-03-01T09:00:00.000Z')],
    );
    expect(list.map((e) => e.finding.id)).toEqual(['high-old', 'high-new', 'medium-old']);
  });
});
