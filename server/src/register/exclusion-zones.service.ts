import { Inject, Injectable } from '@nestjs/common';
import { type ExclusionZone, type ExclusionZoneList, type ExclusionZonePut, type ShapeSpec, suggestExclusionZone } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { topWorkingHeightOf } from './register-context.js';
import { ExclusionZonesRepository, type ZoneWithItem } from './exclusion-zones.repository.js';

type ScaffoldRow = NonNullable<Awaited<ReturnType<ScaffoldsRepository['find']>>>;

function toZone(scaffold: ScaffoldRow, elevation: string, stored: ZoneWithItem | undefined): ExclusionZone {
  const topWorkingHeightM = topWorkingHeightOf(scaffold);
  const item = stored?.item ?? null;
  const wind = stored?.zone.limitingWindMps ?? null;
  return {
    scaffoldId: scaffold.id,
    elevation,
    topWorkingHeightM,
    heaviestItem: item ? { id: item.id, name: item.name, massKg: item.massKg } : null,
    limitingWindMps: wind,
    barrieredWidthM: stored?.zone.barrieredWidthM ?? null,
    suggestion:
      item && wind !== null
        ? suggestExclusionZone({ topWorkingHeightM, item: { name: item.name, massKg: item.massKg, shape: item.shape as ShapeSpec }, limitingWindMps: wind })
        : null,
    updatedAt: stored?.zone.updatedAt.toISOString() ?? null,
  };
}

/** The exclusion zone below each elevation: the setting per elevation, and the suggestion made from it. */
@Injectable()
export class ExclusionZonesService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly zones: ExclusionZonesRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly catalogue: CatalogueRepository,
    private readonly audit: AuditService,
  ) {}

  async list(user: AuthUser, scaffoldId: string): Promise<ExclusionZoneList> {
    const scaffold = await this.visibleScaffold(user, scaffoldId, this.db);
    const stored = await this.zones.ofScaffold(user.organisationId, scaffoldId);
    return { items: scaffold.elevations.map((elevation) => toZone(scaffold, elevation, stored.find((s) => s.zone.elevation === elevation))) };
  }

  async put(user: AuthUser, scaffoldId: string, elevation: string, input: ExclusionZonePut): Promise<ExclusionZone> {
    return this.db.transaction(async (tx) => {
      const scaffold = await this.visibleScaffold(user, scaffoldId, tx);
      if (!scaffold.elevations.includes(elevation)) throw AppError.notFound('Elevation');
      if (input.heaviestItemId && !(await this.catalogue.findVisible(user.organisationId, input.heaviestItemId, tx))) {
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['heaviestItemId'], code: 'unknown_item', message: 'Not an item of the catalogue' },
        ]);
      }
      const before = (await this.zones.ofScaffold(user.organisationId, scaffoldId, tx)).find((s) => s.zone.elevation === elevation);
      await this.zones.upsert(user.organisationId, scaffoldId, elevation, input, tx);
      const after = (await this.zones.ofScaffold(user.organisationId, scaffoldId, tx)).find((s) => s.zone.elevation === elevation);
      const zone = toZone(scaffold, elevation, after);
      await this.audit.record(tx, user, {
        entityType: 'scaffold',
        entityId: scaffoldId,
        action: 'exclusion-zone',
        before: before ? toZone(scaffold, elevation, before) : null,
        after: zone,
      });
      return zone;
    });
  }

  private async visibleScaffold(user: AuthUser, scaffoldId: string, executor: DbExecutor): Promise<ScaffoldRow> {
    const scaffold = await this.scaffolds.find(user.organisationId, scaffoldId, executor);
    const foremanId = scopedForeman(user);
    if (!scaffold || (foremanId && !(await this.scaffolds.inForemanScope(scaffoldId, foremanId, executor)))) throw AppError.notFound('Scaffold');
    return scaffold;
  }
}
