import type { Scaffold } from '@plummet/shared';
import type { scaffolds } from '../db/schema/index.js';

export type ScaffoldRow = typeof scaffolds.$inferSelect;

export function toScaffold(row: ScaffoldRow): Scaffold {
  return {
    id: row.id,
    siteId: row.siteId,
    reference: row.reference,
    description: row.description,
    elevations: row.elevations,
    lifts: row.lifts,
    liftHeightM: row.liftHeightM,
    baysPerElevation: row.baysPerElevation,
    status: row.status,
    foremanId: row.foremanId,
    lastInspectedAt: row.lastInspectedAt?.toISOString() ?? null,
    nextDueAt: row.nextDueAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}
