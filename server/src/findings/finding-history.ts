import type { Finding, FindingControl, FindingHistoryEntry, FindingState, HandBackReason } from '@plummet/shared';
import type { FindingRow } from './finding.mapper.js';

export interface AuditTrailRow {
  action: string;
  at: Date;
  actorId: string | null;
  actorName: string | null;
  before: unknown;
  after: unknown;
}

/** What a state change's audit event records beside the finding (finding-state-commands.ts). */
interface Transition {
  from?: FindingState;
  to?: FindingState;
  note?: string;
  control?: FindingControl | null;
  photoIds?: string[];
  recordId?: string | null;
}

type AfterState = Partial<Finding> & { transition?: Transition };

const blank = { from: null, to: null, note: '', control: null, reason: null, assigneeId: null, recordId: null, photoIds: [] as string[] };

/**
 * A finding's history from its audit events (every command writes exactly one), oldest first. A
 * finding with no create event (demo data written straight to the database) starts with one made
 * from its own row.
 */
export function toFindingHistory(finding: FindingRow, trail: AuditTrailRow[]): FindingHistoryEntry[] {
  const items: FindingHistoryEntry[] = [];
  if (!trail.some((e) => e.action === 'create')) {
    items.push({ ...blank, kind: 'created', at: finding.createdAt.toISOString(), by: finding.createdBy, byName: null, to: 'open', note: finding.notes });
  }
  for (const e of trail) {
    const who = { at: e.at.toISOString(), by: e.actorId, byName: e.actorName };
    const before = (e.before ?? {}) as Partial<Finding>;
    const after = (e.after ?? {}) as AfterState;
    if (e.action === 'create') {
      items.push({ ...blank, ...who, kind: 'created', to: 'open', note: after.notes ?? '' });
    } else if (e.action.startsWith('state:')) {
      const t = after.transition ?? {};
      items.push({
        ...blank,
        ...who,
        kind: 'state',
        from: t.from ?? before.state ?? null,
        to: t.to ?? after.state ?? null,
        note: t.note ?? '',
        control: t.control ?? null,
        recordId: t.recordId ?? null,
        photoIds: t.photoIds ?? [],
      });
    } else if (e.action === 'assign') {
      items.push({ ...blank, ...who, kind: 'assign', assigneeId: after.assigneeId ?? null });
    } else if (e.action === 'hand-back') {
      items.push({ ...blank, ...who, kind: 'hand-back', reason: (after.handBack?.reason as HandBackReason | undefined) ?? null, note: after.handBack?.note ?? '' });
    } else {
      items.push({ ...blank, ...who, kind: 'edit' });
    }
  }
  return items;
}
