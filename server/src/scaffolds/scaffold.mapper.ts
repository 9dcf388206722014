import type { FieldStamps, Scaffold } from '@plummet/shared';
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
    liftHeightsM: row.liftHeightsM,
    baysPerElevation: row.baysPerElevation,
    status: row.status,
    // Every write of the tag (command, inspection, closure) stamps its field with the time.
    statusSetAt: (row.syncFields as FieldStamps | null)?.status?.t ?? null,
    foremanId: row.foremanId,
    regime: row.regime,
    loadClass: row.loadClass,
    designReference: row.designReference,
    erectingContractor: row.erectingContractor,
    handedOverOn: row.handedOverOn,
    lastInspectedAt: row.lastInspectedAt?.toISOString() ?? null,
    nextDueAt: row.nextDueAt?.toISOString() ?? null,
    archivedAt: row.archivedAt?.toISOString() ?? null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    version: row.version,
  };
}
