import { type Finding, type FindingListItem, type LikelihoodAnswers, type ShapeSpec, UNFIXED_STATES } from '@plummet/shared';
import type { findings } from '../db/schema/index.js';

/** The columns a finding's API answer is made from (sync bookkeeping and the like stay out of reads of lists). */
export const FINDING_API_COLUMNS = [
  'id', 'organisationId', 'inspectionId', 'scaffoldId', 'elevation', 'lift', 'bay', 'heightM', 'catalogueItemId', 'itemName',
  'massKg', 'shape', 'exposure', 'likelihoodAnswers', 'likelihood', 'estimate', 'severity', 'riskScore', 'riskBand', 'state',
  'assigneeId', 'dueAt', 'notes', 'madeSafeNote', 'madeSafeControl', 'zoneRadiusM', 'madeSafePhotoIds', 'madeSafeUntil', 'handBack',
  'createdBy', 'createdAt', 'updatedAt', 'version',
] as const;

export type FindingRow = typeof findings.$inferSelect;
/** What the mapper reads: any row with the API columns (a full row or a list row). */
export type FindingApiRow = Pick<FindingRow, (typeof FINDING_API_COLUMNS)[number]>;

const FINDING_LIST_COLUMNS_BASE = [
  'id', 'scaffoldId', 'elevation', 'lift', 'bay', 'heightM', 'itemName', 'riskScore', 'riskBand', 'state', 'assigneeId', 'dueAt',
  'createdAt',
] as const;

export function isOverdue(row: Pick<FindingApiRow, 'state' | 'dueAt'>, now = Date.now()): boolean {
  return row.dueAt !== null && row.dueAt.getTime() < now && UNFIXED_STATES.includes(row.state);
}

export function toFinding(row: FindingApiRow, now = Date.now()): Finding {
  return {
    id: row.id,
    inspectionId: row.inspectionId,
    scaffoldId: row.scaffoldId,
    elevation: row.elevation,
    lift: row.lift,
    bay: row.bay,
    heightM: row.heightM,
    item: {
      catalogueItemId: row.catalogueItemId,
      name: row.itemName,
      massKg: row.massKg,
      shape: (row.shape as ShapeSpec | null) ?? null,
    },
    exposure: row.exposure,
    likelihoodAnswers: row.likelihoodAnswers as LikelihoodAnswers,
    likelihood: row.likelihood,
    estimate: row.estimate as Finding['estimate'],
    severity: row.severity,
    riskScore: row.riskScore,
    riskBand: row.riskBand,
    state: row.state,
    assigneeId: row.assigneeId,
    dueAt: row.dueAt?.toISOString() ?? null,
    overdue: isOverdue(row, now),
    notes: row.notes,
    madeSafeNote: row.madeSafeNote,
    madeSafeUntil: row.madeSafeUntil?.toISOString() ?? null,
    handBack: (row.handBack as Finding['handBack']) ?? null,
    madeSafeControl: (row.madeSafeControl as Finding['madeSafeControl']) ?? null,
    zoneRadiusM: row.zoneRadiusM,
    madeSafePhotoIds: row.madeSafePhotoIds,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}

/** What a row of the CSV export is made from: the list's columns, the whole note and the impact energy read out of the estimate. */
export const FINDING_EXPORT_COLUMNS = [...FINDING_LIST_COLUMNS_BASE, 'massKg', 'exposure', 'severity', 'likelihood', 'notes'] as const;
export type FindingExportRow = Pick<FindingRow, (typeof FINDING_EXPORT_COLUMNS)[number]> & { impactEnergyJ: number };

/** A finding as the export writes it (SI units; the export converts at its edge). */
export interface ExportFinding {
  id: string; scaffoldId: string; elevation: string; lift: number; bay: number; heightM: number; itemName: string; massKg: number;
  exposure: string; impactEnergyJ: number; severity: number; likelihood: number; riskScore: number; riskBand: string; state: string;
  assigneeId: string | null; dueAt: string | null; overdue: boolean; createdAt: string; notes: string;
}

export function toExportFinding(row: FindingExportRow, now = Date.now()): ExportFinding {
  return {
    id: row.id, scaffoldId: row.scaffoldId, elevation: row.elevation, lift: row.lift, bay: row.bay, heightM: row.heightM, itemName: row.itemName,
    massKg: row.massKg, exposure: row.exposure, impactEnergyJ: row.impactEnergyJ, severity: row.severity, likelihood: row.likelihood,
    riskScore: row.riskScore, riskBand: row.riskBand, state: row.state, assigneeId: row.assigneeId, dueAt: row.dueAt?.toISOString() ?? null,
    overdue: isOverdue(row, now), createdAt: row.createdAt.toISOString(), notes: row.notes,
  };
}

/** What a list row is made from: a few columns, the note already cut by PostgreSQL. */
export const FINDING_LIST_COLUMNS = FINDING_LIST_COLUMNS_BASE;
export type FindingListRow = Pick<FindingRow, (typeof FINDING_LIST_COLUMNS)[number]> & { notePreview: string };

/** A list row: no estimate, the note cut short (FindingListItemSchema). */
export function toFindingListItem(row: FindingListRow, now = Date.now()): FindingListItem {
  return {
    id: row.id,
    scaffoldId: row.scaffoldId,
    elevation: row.elevation,
    lift: row.lift,
    bay: row.bay,
    heightM: row.heightM,
    itemName: row.itemName,
    riskScore: row.riskScore,
    riskBand: row.riskBand,
    state: row.state,
    assigneeId: row.assigneeId,
    dueAt: row.dueAt?.toISOString() ?? null,
    overdue: isOverdue(row, now),
    notePreview: row.notePreview,
    createdAt: row.createdAt.toISOString(),
  };
}
