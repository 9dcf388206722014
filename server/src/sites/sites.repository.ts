import { Inject, Injectable } from '@nestjs/common';
import { and, eq, type SQL, sql } from 'drizzle-orm';
import type { SiteCreate, SiteListQuery, SiteUpdate } from '@plummet/shared';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { scaffolds, sites } from '../db/schema/index.js';
import type { SiteRow } from './site.mapper.js';

const SORTS: Record<SiteListQuery['sort'], SortKey> = {
  name: { expr: sites.name, cast: 'text' },
  createdAt: { expr: sites.createdAt, cast: 'timestamptz' },
  updatedAt: { expr: sites.updatedAt, cast: 'timestamptz' },
};

@Injectable()
export class SitesRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async list(organisationId: string, query: SiteListQuery, executor: DbExecutor = this.db) {
    const page = keyset(SORTS[query.sort], sites.id, query);
    const where: (SQL | undefined)[] = [eq(sites.organisationId, organisationId), page.after];
    if (query.regime) where.push(eq(sites.regime, query.regime));
    if (query.jurisdiction) where.push(eq(sites.jurisdiction, query.jurisdiction));
    return executor
      .select({ row: sites, sortKey: page.sortKey })
      .from(sites)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  /** The site of this organisation, or undefined; `forUpdate` locks it for the transaction. */
  async find(organisationId: string, id: string, executor: DbExecutor = this.db, forUpdate = false): Promise<SiteRow | undefined> {
    const q = executor
      .select()
      .from(sites)
      .where(and(eq(sites.id, id), eq(sites.organisationId, organisationId)));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row;
  }

  async insert(organisationId: string, values: SiteCreate, executor: DbExecutor = this.db): Promise<SiteRow> {
    const [row] = await executor
      .insert(sites)
      .values({ ...values, organisationId })
      .returning();
    return row;
  }

  async update(id: string, changes: Omit<SiteUpdate, 'version'>, executor: DbExecutor = this.db): Promise<SiteRow> {
    const [row] = await executor
      .update(sites)
      .set({ ...changes, version: sql`${sites.version} + 1`, updatedAt: sql`now()` })
      .where(eq(sites.id, id))
      .returning();
    return row;
  }

  async delete(id: string, executor: DbExecutor = this.db): Promise<void> {
    await executor.delete(sites).where(eq(sites.id, id));
  }

  async countScaffolds(siteId: string, executor: DbExecutor = this.db): Promise<number> {
    const [row] = await executor
      .select({ n: sql<number>`count(*)::int` })
      .from(scaffolds)
      .where(eq(scaffolds.siteId, siteId));
    return row?.n ?? 0;
  }
}
