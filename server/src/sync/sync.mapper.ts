import type { SyncConflict, SyncFinding } from '@plummet/shared';
import { toFinding, type FindingRow } from '../findings/finding.mapper.js';
import type { SyncConflictRow } from './sync.repository.js';

export function toSyncFinding(row: FindingRow, siteId: string): SyncFinding {
  return { ...toFinding(row), organisationId: row.organisationId, siteId };
}

export function toSyncConflict(row: SyncConflictRow): SyncConflict {
  return {
    id: row.id,
    entity: row.entity as SyncConflict['entity'],
    entityId: row.entityId,
    field: row.field,
    currentValue: row.currentValue,
    replacedValue: row.replacedValue,
    winnerUserId: row.winnerUserId,
    status: row.status,
    resolution: (row.resolution as SyncConflict['resolution']) ?? null,
    resolvedBy: row.resolvedBy,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
  };
}
