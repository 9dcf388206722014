import type { SyncConflict, SyncFinding } from '@plummet/shared';
import { toFinding, type FindingApiRow } from '../findings/finding.mapper.js';
import type { SyncConflictRow } from './sync.repository.js';

export function toSyncFinding(row: FindingApiRow, siteId: string, now = Date.now()): SyncFinding {
  // toFinding's answer is a fresh object: extended in place, not copied (a pull maps a thousand per page).
  const record = toFinding(row, now) as SyncFinding;
  record.organisationId = row.organisationId;
  record.siteId = siteId;
  return record;
}

/** A conflict as the API gives it; `names` (conflictWriterNames) names its writers. */
export function toSyncConflict(row: SyncConflictRow, names: ReadonlyMap<string, string>): SyncConflict {
  return {
    id: row.id,
    entity: row.entity as SyncConflict['entity'],
    entityId: row.entityId,
    field: row.field,
    currentValue: row.currentValue,
    replacedValue: row.replacedValue,
    winnerUserId: row.winnerUserId,
    replacedUserId: row.replacedUserId,
    replacedAt: row.replacedAt?.toISOString() ?? null,
    winnerName: (row.winnerUserId && names.get(row.winnerUserId)) ?? null,
    replacedName: (row.replacedUserId && names.get(row.replacedUserId)) ?? null,
    status: row.status,
    resolution: (row.resolution as SyncConflict['resolution']) ?? null,
    resolvedBy: row.resolvedBy,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}
