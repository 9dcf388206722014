import { checkFindingTransition, type FindingState, type Role } from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import { newId } from '../../local-db/ids';
import { enqueueChange } from '../../local-db/outbox';
import type { FindingRecord, PhotoRecord } from '../../local-db/records';
import { addPhotos } from '../photos/photos.store';
import { findingCreateOf, findingUpdateOf, looksLikeFinding, restoreFinding } from './finding-record';

/**
 * Saves a finding made or edited on the phone: the record, its new photos and their outbox
 * entries in one transaction. A new finding queues its create; an edit queues an update of the
 * fields that changed only (folded into a create or update still waiting and not yet tried);
 * a new assignee queues the assignment; becoming "made safe" queues the state change with its note.
 */
export async function saveFinding(database: PlummetDb, finding: FindingRecord, newPhotos: readonly PhotoRecord[] = []): Promise<void> {
  await database.transaction('rw', database.findings, database.photos, database.outbox, async () => {
    const previous = await database.findings.get(finding.id);
    await database.findings.put(finding);
    if (!previous) {
      await enqueueChange(database, finding.id, { entity: 'finding', action: 'create', payload: findingCreateOf(finding) });
    } else {
      const changed = findingUpdateOf(finding, previous);
      if (changed) await enqueueChange(database, finding.id, { entity: 'finding', action: 'update', payload: changed });
    }
    if (finding.assigneeId !== (previous?.assigneeId ?? null)) {
      // Given to a foreman while recording: the assignment travels with the record, offline too.
      await enqueueChange(database, finding.id, { entity: 'finding', action: 'assign', payload: { assigneeId: finding.assigneeId, dueAt: finding.dueAt } });
    }
    if (finding.state === 'made-safe' && previous?.state !== 'made-safe') {
      // The finding's own photos are the proof of a measure taken while recording it.
      const stored = (await database.photos.where('[ownerType+ownerId]').equals(['finding', finding.id]).primaryKeys()) as string[];
      const photoIds = [...new Set([...stored, ...newPhotos.filter((p) => p.ownerType === 'finding' && p.ownerId === finding.id).map((p) => p.id)])].slice(0, 10);
      await enqueueChange(database, finding.id, {
        entity: 'finding',
        action: 'state',
        payload: { to: 'made-safe', note: finding.madeSafeNote ?? '', photoIds },
      });
    }
    await addPhotos(database, newPhotos);
  });
}

/**
 * Moves a finding to another state on the phone (fixed, verified, reopened, made safe) and queues
 * the command for the server, in one transaction. The shared state machine checks it here first so
 * the phone never shows a state the server would refuse; the server checks again (it has the
 * last word: a move another phone made meanwhile may make this one a no-op or a refusal).
 */
export async function changeFindingState(
  database: PlummetDb,
  findingId: string,
  change: { to: FindingState; note?: string; role: Role; foremanInScope?: boolean },
  now: Date = new Date(),
): Promise<FindingRecord> {
  return database.transaction('rw', database.findings, database.outbox, async () => {
    const finding = await database.findings.get(findingId);
    if (!finding) throw new Error('This finding is not on this phone.');
    if (finding.state === change.to) return finding;
    const check = checkFindingTransition(finding.state, change.to, change.role, change.foremanInScope ?? false);
    if (!check.ok) throw new Error(`A finding cannot move from ${finding.state} to ${change.to} (${check.reason}).`);
    const note = change.note?.trim() ?? '';
    const updated: FindingRecord = {
      ...finding,
      state: change.to,
      ...(check.transition.kind === 'make-safe' ? { madeSafeNote: note } : {}),
      updatedAt: now.toISOString(),
    };
    await database.findings.put(updated);
    await enqueueChange(database, findingId, { entity: 'finding', action: 'state', payload: { to: change.to, note, recordId: newId() } }, now);
    return updated;
  });
}

export const markFindingFixed = (database: PlummetDb, findingId: string, role: Role, note = '', foremanInScope = false) =>
  changeFindingState(database, findingId, { to: 'fixed', note, role, foremanInScope });
export const markFindingVerified = (database: PlummetDb, findingId: string, role: Role, note = '') => changeFindingState(database, findingId, { to: 'verified', note, role });
export const reopenFinding = (database: PlummetDb, findingId: string, role: Role, note = '') => changeFindingState(database, findingId, { to: 'open', note, role });

export async function getFinding(database: PlummetDb, id: string): Promise<FindingRecord | undefined> {
  return restoreFinding(await database.findings.get(id));
}

/** Highest risk first, then the most recent. */
export function byRisk(a: FindingRecord, b: FindingRecord): number {
  return b.riskScore - a.riskScore || b.updatedAt.localeCompare(a.updatedAt);
}

export async function findingsOfScaffold(database: PlummetDb, scaffoldId: string): Promise<FindingRecord[]> {
  const rows = await database.findings.where('scaffoldId').equals(scaffoldId).toArray();
  return rows.filter(looksLikeFinding).sort(byRisk);
}

export async function findingsOfInspection(database: PlummetDb, inspectionId: string): Promise<FindingRecord[]> {
  const rows = await database.findings.where('inspectionId').equals(inspectionId).toArray();
  return rows.filter(looksLikeFinding).sort(byRisk);
}

export async function findingsOfSite(database: PlummetDb, siteId: string): Promise<FindingRecord[]> {
  const rows = await database.findings.where('siteId').equals(siteId).toArray();
  return rows.filter(looksLikeFinding).sort(byRisk);
}
