import { type Finding, type FindingListItem, type LikelihoodAnswers, type ShapeSpec, UNFIXED_STATES } from '@plummet/shared';
import type { findings } from '../db/schema/index.js';

export type FindingRow = typeof findings.$inferSelect;

export function isOverdue(row: Pick<FindingRow, 'state' | 'dueAt'>, now = Date.now()): boolean {
  return row.dueAt !== null && row.dueAt.getTime() < now && UNFIXED_STATES.includes(row.state);
}

export function toFinding(row: FindingRow, now = Date.now()): Finding {
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
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}

/** A row read by the list query, whose estimate PostgreSQL already trimmed to the summary. */
export function toFindingListItem(row: FindingRow, now = Date.now()): FindingListItem {
  return toFinding(row, now) as unknown as FindingListItem;
}
