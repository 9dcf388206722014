import {
  CONTROLS,
  nextInspectionDue,
  effectiveRegime,
  type Control,
  type ControlResult,
  type InspectionFinish,
  type InspectionReason,
} from '@plummet/shared';
import type { PlummetDb } from '../../local-db/db';
import { newId } from '../../local-db/ids';
import { enqueueChange } from '../../local-db/outbox';
import type { ControlCheckRecord, InspectionRecord, PhotoRecord, ScaffoldRecord, SiteRecord } from '../../local-db/records';
import { addPhotos } from '../photos/photos.store';

export interface InspectionStart {
  id?: string;
  scaffold: Pick<ScaffoldRecord, 'id' | 'siteId' | 'organisationId'>;
  inspectorId: string;
  reason: InspectionReason;
  /** m/s, or null when not measured. */
  windSpeedMps: number | null;
}

/** Starts a walk: the inspection and its create entry, in one transaction. */
export async function startInspection(database: PlummetDb, start: InspectionStart, now = new Date()): Promise<InspectionRecord> {
  const at = now.toISOString();
  const inspection: InspectionRecord = {
    id: start.id ?? newId(),
    organisationId: start.scaffold.organisationId,
    siteId: start.scaffold.siteId,
    scaffoldId: start.scaffold.id,
    inspectorId: start.inspectorId,
    status: 'in-progress',
    startedAt: at,
    finishedAt: null,
    reason: start.reason,
    windSpeedMps: start.windSpeedMps,
    reportFor: '',
    location: '',
    equipment: '',
    mattersGivingRisk: '',
    actionTaken: '',
    furtherAction: '',
    reporterName: '',
    reporterPosition: '',
    signature: null,
    signedAt: null,
    tagStatus: null,
    restriction: '',
    accessTagsChanged: null,
    createdAt: at,
    updatedAt: at,
    version: 0,
  };
  await database.transaction('rw', database.inspections, database.outbox, async () => {
    await database.inspections.add(inspection);
    await enqueueChange(
      database,
      inspection.id,
      { entity: 'inspection', action: 'create', payload: { id: inspection.id, scaffoldId: inspection.scaffoldId, reason: inspection.reason, windSpeedMps: inspection.windSpeedMps, startedAt: at } },
      now,
    );
  });
  return inspection;
}

export interface ControlCheckAnswer {
  /** The id for a first answer (photos may need it before the check is stored); an existing check keeps its own. */
  id?: string;
  inspectionId: string;
  organisationId: string;
  control: Control;
  result: ControlResult;
  note: string;
}

/**
 * Records one falling-object control as pass, fail or not applicable, with its note and any new
 * photos. Answering the same control again replaces the answer (and folds its waiting entry).
 */
export async function recordControlCheck(
  database: PlummetDb,
  answer: ControlCheckAnswer,
  newPhotos: readonly PhotoRecord[] = [],
  now = new Date(),
): Promise<ControlCheckRecord> {
  return database.transaction('rw', database.controlChecks, database.photos, database.outbox, async () => {
    const existing = await database.controlChecks.where('[inspectionId+control]').equals([answer.inspectionId, answer.control]).first();
    const at = now.toISOString();
    const check: ControlCheckRecord = {
      id: existing?.id ?? answer.id ?? newId(),
      organisationId: answer.organisationId,
      inspectionId: answer.inspectionId,
      control: answer.control,
      result: answer.result,
      note: answer.note,
      createdAt: existing?.createdAt ?? at,
      updatedAt: at,
      version: existing?.version ?? 0,
    };
    await database.controlChecks.put(check);
    await enqueueChange(
      database,
      check.id,
      { entity: 'control-check', action: 'put', payload: { inspectionId: check.inspectionId, control: check.control, result: check.result, note: check.note } },
      now,
    );
    await addPhotos(database, newPhotos);
    return check;
  });
}

export async function controlChecksOf(database: PlummetDb, inspectionId: string): Promise<ControlCheckRecord[]> {
  const checks = await database.controlChecks.where('inspectionId').equals(inspectionId).toArray();
  return checks.sort((a, b) => CONTROLS.indexOf(a.control) - CONTROLS.indexOf(b.control));
}

/** The controls not answered yet, in the order of the checklist. */
export function unansweredControls(checks: readonly Pick<ControlCheckRecord, 'control'>[]): Control[] {
  const answered = new Set(checks.map((check) => check.control));
  return CONTROLS.filter((control) => !answered.has(control));
}

export class InspectionNotFinishableError extends Error {
  override readonly name = 'InspectionNotFinishableError';
}

/**
 * Finishes the walk with the statutory report (UK WAHR 2005 Schedule 7 fields) and signature.
 * The scaffold's last inspection and next due date move on the phone at once; the server sets
 * its own when the finish reaches it.
 */
export async function finishInspection(
  database: PlummetDb,
  inspectionId: string,
  report: InspectionFinish,
  now = new Date(),
): Promise<InspectionRecord> {
  return database.transaction('rw', [database.inspections, database.controlChecks, database.scaffolds, database.sites, database.outbox], async () => {
    const inspection = await database.inspections.get(inspectionId);
    if (!inspection) throw new InspectionNotFinishableError('That inspection is not on this phone.');
    if (inspection.status === 'finished') throw new InspectionNotFinishableError('That inspection is already finished.');
    const missing = unansweredControls(await database.controlChecks.where('inspectionId').equals(inspectionId).toArray());
    if (missing.length > 0) throw new InspectionNotFinishableError(`Answer every control check first (${missing.length} left).`);
    const at = report.finishedAt ?? now.toISOString();
    const finished: InspectionRecord = {
      ...inspection,
      ...report,
      status: 'finished',
      finishedAt: at,
      signedAt: at,
      updatedAt: now.toISOString(),
    };
    await database.inspections.put(finished);
    await enqueueChange(database, inspectionId, { entity: 'inspection', action: 'finish', payload: { ...report, finishedAt: at } }, now);
    const scaffold = await database.scaffolds.get(inspection.scaffoldId);
    const site: SiteRecord | undefined = scaffold ? await database.sites.get(scaffold.siteId) : undefined;
    if (scaffold) {
      const nextDueAt = site ? nextInspectionDue(new Date(at), effectiveRegime(site.regime, scaffold.regime), site.timeZone).toISOString() : scaffold.nextDueAt;
      // The tag status the inspector recorded shows on the phone at once, as on the server.
      const newTag = report.tagStatus && report.tagStatus !== scaffold.status ? report.tagStatus : undefined;
      await database.scaffolds.put({ ...scaffold, lastInspectedAt: at, nextDueAt, ...(newTag ? { status: newTag, statusSetAt: at } : {}) });
    }
    return finished;
  });
}

/** The walk under way on a scaffold, if any (one at a time per scaffold on this phone). */
export async function inspectionInProgress(database: PlummetDb, scaffoldId: string): Promise<InspectionRecord | undefined> {
  const rows = await database.inspections.where('scaffoldId').equals(scaffoldId).toArray();
  return rows.filter((row) => row.status === 'in-progress').sort((a, b) => b.startedAt.localeCompare(a.startedAt))[0];
}
