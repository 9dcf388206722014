import type { ControlCheck, Inspection } from '@plummet/shared';
import type { controlChecks, inspections } from '../db/schema/index.js';

export type InspectionRow = typeof inspections.$inferSelect;
export type ControlCheckRow = typeof controlChecks.$inferSelect;

export function toInspection(row: InspectionRow): Inspection {
  return {
    id: row.id,
    scaffoldId: row.scaffoldId,
    inspectorId: row.inspectorId,
    startedAt: row.startedAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
    reason: row.reason,
    windSpeedMps: row.windSpeedMps,
    reportFor: row.reportFor,
    location: row.location,
    equipment: row.equipment,
    mattersGivingRisk: row.mattersGivingRisk,
    actionTaken: row.actionTaken,
    furtherAction: row.furtherAction,
    reporterName: row.reporterName,
    reporterPosition: row.reporterPosition,
    signature: row.signature,
    signedAt: row.signedAt?.toISOString() ?? null,
    tagStatus: row.tagStatus,
    restriction: row.restriction,
    accessTagsChanged: row.accessTagsChanged,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}

export function toControlCheck(row: ControlCheckRow): ControlCheck {
  return {
    id: row.id,
    inspectionId: row.inspectionId,
    control: row.control,
    result: row.result,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}
