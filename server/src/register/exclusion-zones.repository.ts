import { Inject, Injectable } from '@nestjs/common';
import { and, eq, sql } from 'drizzle-orm';
import type { ExclusionZonePut } from '@plummet/shared';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { catalogueItems, exclusionZones } from '../db/schema/index.js';

export type ExclusionZoneRow = typeof exclusionZones.$inferSelect;
export type ZoneWithItem = { zone: ExclusionZoneRow; item: typeof catalogueItems.$inferSelect | null };

@Injectable()
export class ExclusionZonesRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async ofScaffold(organisationId: string, scaffoldId: string, executor: DbExecutor = this.db): Promise<ZoneWithItem[]> {
    return executor
      .select({ zone: exclusionZones, item: catalogueItems })
      .from(exclusionZones)
      .leftJoin(catalogueItems, eq(catalogueItems.id, exclusionZones.heaviestItemId))
      .where(and(eq(exclusionZones.organisationId, organisationId), eq(exclusionZones.scaffoldId, scaffoldId)));
  }

  async upsert(organisationId: string, scaffoldId: string, elevation: string, values: ExclusionZonePut, executor: DbExecutor = this.db): Promise<ExclusionZoneRow> {
    const [row] = await executor
      .insert(exclusionZones)
      .values({ organisationId, scaffoldId, elevation, ...values })
      .onConflictDoUpdate({
        target: [exclusionZones.scaffoldId, exclusionZones.elevation],
        set: { ...values, updatedAt: sql`now()`, version: sql`${exclusionZones.version} + 1` },
      })
      .returning();
    return row;
  }
}
