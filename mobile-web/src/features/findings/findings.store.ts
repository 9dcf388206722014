import type { PlummetDb } from '../../local-db/db';
import { enqueueChange } from '../../local-db/outbox';
import type { FindingRecord, PhotoRecord } from '../../local-db/records';
import { addPhotos } from '../photos/photos.store';
import { findingCreateOf, findingUpdateOf, looksLikeFinding, restoreFinding } from './finding-record';

/**
 * Saves a finding made or edited on the phone: the record, its new photos and their outbox
 * entries in one transaction. A new finding queues its create; an edit queues an update (folded
 * into a create that is still waiting); becoming "made safe" queues the state change with its note.
 */
export async function saveFinding(database: PlummetDb, finding: FindingRecord, newPhotos: readonly PhotoRecord[] = []): Promise<void> {
  await database.transaction('rw', database.findings, database.photos, database.outbox, async () => {
    const previous = await database.findings.get(finding.id);
    await database.findings.put(finding);
    if (!previous) {
      await enqueueChange(database, finding.id, { entity: 'finding', action: 'create', payload: findingCreateOf(finding) });
    } else {
      await enqueueChange(database, finding.id, { entity: 'finding', action: 'update', payload: findingUpdateOf(finding) });
    }
    if (finding.state === 'made-safe' && previous?.state !== 'made-safe') {
      await enqueueChange(database, finding.id, {
        entity: 'finding',
        action: 'state',
        payload: { to: 'made-safe', note: finding.madeSafeNote ?? '' },
      });
    }
    await addPhotos(database, newPhotos);
  });
}

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
