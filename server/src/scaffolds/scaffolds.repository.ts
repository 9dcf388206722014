import { Inject, Injectable } from '@nestjs/common';
import { and, eq, inArray, isNotNull, lt, type SQL, sql } from 'drizzle-orm';
import type { FieldStamps, InspectionRegime, ScaffoldCreate, ScaffoldListQuery, ScaffoldStatus, ScaffoldUpdate } from '@plummet/shared';
import { scaffoldInScope } from '../common/foreman-scope.js';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { memberships, scaffolds, sites } from '../db/schema/index.js';
import type { ScaffoldRow } from './scaffold.mapper.js';

const SORTS: Record<ScaffoldListQuery['sort'], SortKey> = {
  reference: { expr: scaffolds.reference, cast: 'text' },
  createdAt: { expr: scaffolds.createdAt, cast: 'timestamptz' },
  updatedAt: { expr: scaffolds.updatedAt, cast: 'timestamptz' },
  // Never inspected sorts last going forward in time.
  nextDueAt: { expr: sql`coalesce(${scaffolds.nextDueAt}, 'infinity'::timestamptz)`, cast: 'timestamptz' },
};

/** The scaffold, with the regime it is inspected under (its own, else its site's) and the site's time zone (for when the next inspection is due). */
export interface ScaffoldWithSite {
  scaffold: ScaffoldRow;
  site: { regime: '7-day' | 'pre-shift'; timeZone: string };
}

@Injectable()
export class ScaffoldsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** A page of the organisation's scaffolds; with `foremanId`, only that foreman's scope. */
  async list(organisationId: string, query: ScaffoldListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    const page = keyset(SORTS[query.sort], scaffolds.id, query);
    const where: (SQL | undefined)[] = [eq(scaffolds.organisationId, organisationId), page.after];
    if (foremanId) where.push(scaffoldInScope(scaffolds.id, foremanId));
    if (query.siteId) where.push(eq(scaffolds.siteId, query.siteId));
    if (query.status) where.push(inArray(scaffolds.status, query.status));
    if (query.foremanId) where.push(eq(scaffolds.foremanId, query.foremanId));
    if (query.overdue === true) where.push(and(isNotNull(scaffolds.nextDueAt), lt(scaffolds.nextDueAt, sql`now()`)));
    if (query.overdue === false) where.push(sql`(${scaffolds.nextDueAt} is null or ${scaffolds.nextDueAt} >= now())`);
    return executor
      .select({ row: scaffolds, sortKey: page.sortKey })
      .from(scaffolds)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  async find(organisationId: string, id: string, executor: DbExecutor = this.db, forUpdate = false): Promise<ScaffoldRow | undefined> {
    const q = executor
      .select()
      .from(scaffolds)
      .where(and(eq(scaffolds.id, id), eq(scaffolds.organisationId, organisationId)));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row;
  }

  /** Whether the scaffold is in the foreman's scope. */
  async inForemanScope(scaffoldId: string, foremanId: string, executor: DbExecutor = this.db): Promise<boolean> {
    const result = await executor.execute<{ ok: boolean }>(sql`select ${scaffoldInScope(sql`${scaffoldId}::uuid`, foremanId)} as ok`);
    return result.rows[0]?.ok === true;
  }

  async findWithSite(organisationId: string, id: string, executor: DbExecutor = this.db): Promise<ScaffoldWithSite | undefined> {
    const [row] = await executor
      .select({
        scaffold: scaffolds,
        site: { regime: sql<InspectionRegime>`coalesce(${scaffolds.regime}, ${sites.regime})`, timeZone: sites.timeZone },
      })
      .from(scaffolds)
      .innerJoin(sites, eq(sites.id, scaffolds.siteId))
      .where(and(eq(scaffolds.id, id), eq(scaffolds.organisationId, organisationId)))
      .for('update', { of: scaffolds });
    return row;
  }

  async insert(organisationId: string, values: ScaffoldCreate, executor: DbExecutor = this.db): Promise<ScaffoldRow> {
    const [row] = await executor
      .insert(scaffolds)
      .values({ ...values, organisationId })
      .returning();
    return row;
  }

  async update(
    id: string,
    changes: Omit<ScaffoldUpdate, 'version'> & { status?: ScaffoldStatus; syncFields?: FieldStamps; lastInspectedAt?: Date; nextDueAt?: Date; archivedAt?: Date },
    executor: DbExecutor = this.db,
  ): Promise<ScaffoldRow> {
    const [row] = await executor
      .update(scaffolds)
      .set({ ...changes, version: sql`${scaffolds.version} + 1`, updatedAt: sql`now()` })
      .where(eq(scaffolds.id, id))
      .returning();
    return row;
  }

  /** Whether the user holds the foreman role in this organisation. */
  async isForeman(organisationId: string, userId: string, executor: DbExecutor = this.db): Promise<boolean> {
    const [row] = await executor
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.organisationId, organisationId), eq(memberships.userId, userId)));
    return row?.role === 'foreman';
  }
}
