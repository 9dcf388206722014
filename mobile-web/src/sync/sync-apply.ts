/** Writing what the server sent into Dexie: pulled pages and the records a push answer carries. */
import type { SyncChange, SyncConflict, SyncPullResponse, SyncTombstone } from '@plummet/shared';
import { catalogueRecordOf } from '../features/catalogue/catalogue-search';
import { readMeta, writeMeta, type PlummetDb } from '../local-db/db';
import { keepSignedReport } from '../local-db/signed-reports';
import { idsWithWaitingChanges } from '../local-db/outbox';
import type { FindingRecord, InspectionRecord, ScaffoldRecord, SiteRecord } from '../local-db/records';
import { readConflicts, SYNC_META } from './sync-state';

/** Versions only grow on the server: an older copy (a slow answer) never replaces a newer one. */
export async function putIfNewer(database: PlummetDb, record: FindingRecord): Promise<void> {
  const local = await database.findings.get(record.id);
  if (!local || record.version >= local.version) await database.findings.put(record);
}

/** Records with changes still waiting in the outbox, by outbox entity (a control check's entity id is its inspection). */
export interface Waiting {
  finding: Set<string>;
  inspection: Set<string>;
  controlCheckInspections: Set<string>;
  scaffold: Set<string>;
}

async function waitingChanges(database: PlummetDb): Promise<Waiting> {
  const [finding, inspection, controlCheckInspections, scaffold] = await Promise.all([
    idsWithWaitingChanges(database, 'finding'),
    idsWithWaitingChanges(database, 'inspection'),
    idsWithWaitingChanges(database, 'control-check'),
    // A tag status set on this phone and not sent yet.
    idsWithWaitingChanges(database, 'scaffold'),
  ]);
  return { finding, inspection, controlCheckInspections, scaffold };
}

/** Every table a page may touch (one transaction for the page and its cursor). */
export function syncedTables(database: PlummetDb) {
  return [
    database.sites,
    database.scaffolds,
    database.inspections,
    database.controlChecks,
    database.findings,
    database.fixes,
    database.verifications,
    database.photoMeta,
    database.catalogue,
    database.signedReports,
    database.outbox,
    database.meta,
  ];
}

/**
 * One page of the feed, with its cursor (unless `feedCursor` is false: a site's first pull), in one transaction. A record with changes still waiting
 * keeps the phone's copy (its base version stays the one the user edited from); a conflict is kept
 * while open and dropped once settled; a tombstone deletes the record and what hangs off it.
 */
export async function applyPulledPage(database: PlummetDb, page: SyncPullResponse, organisationId = '', options: { feedCursor?: boolean } = {}): Promise<void> {
  await database.transaction('rw', syncedTables(database), async () => {
    const waiting = await waitingChanges(database);
    const conflicts: Record<string, SyncConflict> = await readConflicts(database);
    const org = organisationId || (await orgOf(database, page.changes));
    const me = await userOf(database, page.changes);
    for (const change of page.changes) await applyChange(database, change, waiting, conflicts, org, me);
    await writeMeta(database, SYNC_META.conflicts, conflicts);
    // A site's first pull has a cursor of its own: the phone's feed cursor stays where it was.
    if (options.feedCursor !== false) await writeMeta(database, SYNC_META.cursor, page.cursor);
  });
}

/** The organisation records are filed under: from the page's profile, else the one stored. */
async function orgOf(database: PlummetDb, changes: SyncChange[]): Promise<string> {
  for (const change of changes) if (change.type === 'user') return change.record.organisation.id;
  const site = await database.sites.toCollection().first();
  return site?.organisationId ?? '';
}

/** Whose phone this is: the page's profile, else the one stored, else the signed-in session's user. */
async function userOf(database: PlummetDb, changes: SyncChange[]): Promise<string> {
  for (const change of changes) if (change.type === 'user') return change.record.id;
  const profile = await readMeta<{ id?: string }>(database, SYNC_META.profile);
  const session = await readMeta<{ user?: { id?: string } }>(database, 'session');
  return profile?.id ?? session?.user?.id ?? '';
}

/**
 * A pulled inspection the phone keeps: one it holds already, a signed one (read-only, its report and
 * findings readable on the phone), or one its own user carries out. Another inspector's walk still
 * under way stays off the phone: only that inspector edits it, and the phone would offer to carry on with it.
 */
export function keepsInspection(inspection: { inspectorId: string; finishedAt: string | null }, me: string, held: boolean): boolean {
  return held || inspection.finishedAt !== null || (me !== '' && inspection.inspectorId === me);
}

async function applyChange(database: PlummetDb, change: SyncChange, waiting: Waiting, conflicts: Record<string, SyncConflict>, organisationId: string, me: string) {
  switch (change.type) {
    case 'finding':
      if (!waiting.finding.has(change.record.id)) await putIfNewer(database, change.record as FindingRecord);
      return;
    case 'conflict':
      if (change.record.status === 'open') conflicts[change.record.id] = change.record;
      else delete conflicts[change.record.id];
      return;
    case 'site': {
      // The phone's own flags (made available offline, when) stay.
      const local = await database.sites.get(change.record.id);
      const record: SiteRecord = { ...local, ...change.record, organisationId };
      if (!local || record.version >= local.version) await database.sites.put(record);
      return;
    }
    case 'scaffold': {
      if (waiting.scaffold.has(change.record.id)) return;
      const local = await database.scaffolds.get(change.record.id);
      const record: ScaffoldRecord = { ...change.record, organisationId };
      if (!local || record.version >= local.version) await database.scaffolds.put(record);
      return;
    }
    case 'inspection': {
      if (waiting.inspection.has(change.record.id)) return;
      // Any phone's signed report becomes its scaffold's last one here, readable offline.
      if (change.record.finishedAt) await keepSignedReport(database, { ...change.record, controlChecks: [], organisationId });
      const local = await database.inspections.get(change.record.id);
      if (!keepsInspection(change.record, me, local !== undefined)) return;
      const scaffold = await database.scaffolds.get(change.record.scaffoldId);
      const record: InspectionRecord = {
        ...change.record,
        organisationId,
        siteId: scaffold?.siteId ?? local?.siteId ?? '',
        status: change.record.finishedAt ? 'finished' : 'in-progress',
      };
      if (!local || record.version >= local.version) await database.inspections.put(record);
      return;
    }
    case 'control-check': {
      if (waiting.controlCheckInspections.has(change.record.inspectionId)) return;
      // One check per control of an inspection: a copy made on the phone has its own id.
      const local = await database.controlChecks.where('[inspectionId+control]').equals([change.record.inspectionId, change.record.control]).first();
      if (local && local.version > change.record.version) return;
      if (local && local.id !== change.record.id) await database.controlChecks.delete(local.id);
      await database.controlChecks.put({ ...change.record, organisationId });
      return;
    }
    case 'fix':
      await database.fixes.put(change.record);
      return;
    case 'verification':
      await database.verifications.put(change.record);
      return;
    case 'photo':
      await database.photoMeta.put(change.record);
      return;
    case 'catalogue-item':
      await database.catalogue.put(catalogueRecordOf(change.record));
      return;
    case 'user':
      await writeMeta(database, SYNC_META.profile, change.record);
      return;
    case 'tombstone':
      await applyTombstone(database, change.record, waiting, conflicts);
      return;
  }
}

/** Drops a record the phone must no longer hold, with what hangs off it. Waiting local work stays until sent. */
export async function applyTombstone(database: PlummetDb, tombstone: SyncTombstone, waiting: Waiting, conflicts: Record<string, SyncConflict>): Promise<void> {
  const { id } = tombstone;
  const dropFinding = async (findingId: string) => {
    if (waiting.finding.has(findingId)) return;
    await database.findings.delete(findingId);
    await database.fixes.where('findingId').equals(findingId).delete();
    await database.verifications.where('findingId').equals(findingId).delete();
    await database.photoMeta.where('[ownerType+ownerId]').equals(['finding', findingId]).delete();
  };
  const dropInspection = async (inspectionId: string) => {
    if (waiting.inspection.has(inspectionId) || waiting.controlCheckInspections.has(inspectionId)) return;
    await database.inspections.delete(inspectionId);
    await database.controlChecks.where('inspectionId').equals(inspectionId).delete();
  };
  const dropScaffold = async (scaffoldId: string) => {
    await database.scaffolds.delete(scaffoldId);
    for (const findingId of await database.findings.where('scaffoldId').equals(scaffoldId).primaryKeys()) await dropFinding(findingId);
    for (const inspectionId of await database.inspections.where('scaffoldId').equals(scaffoldId).primaryKeys()) await dropInspection(inspectionId);
  };
  switch (tombstone.recordType) {
    case 'site':
      for (const scaffoldId of await database.scaffolds.where('siteId').equals(id).primaryKeys()) await dropScaffold(scaffoldId);
      await database.sites.delete(id);
      return;
    case 'scaffold':
      return dropScaffold(id);
    case 'finding':
      return dropFinding(id);
    case 'inspection':
      return dropInspection(id);
    case 'control-check':
      return database.controlChecks.delete(id);
    case 'fix':
      return database.fixes.delete(id);
    case 'verification':
      return database.verifications.delete(id);
    case 'photo':
      return database.photoMeta.delete(id);
    case 'catalogue-item':
      return database.catalogue.delete(id);
    case 'conflict':
      delete conflicts[id];
      return;
    case 'user':
      return;
  }
}
