import { Inject, Injectable } from '@nestjs/common';
import { and, eq, ilike, inArray, isNotNull, isNull, or, type SQL, sql } from 'drizzle-orm';
import type { CatalogueItemCreate, CatalogueItemUpdate, CatalogueListQuery } from '@plummet/shared';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { catalogueItems } from '../db/schema/index.js';
import type { CatalogueItemRow } from './catalogue.mapper.js';

const SORTS: Record<CatalogueListQuery['sort'], SortKey> = {
  name: { expr: catalogueItems.name, cast: 'text' },
  category: { expr: catalogueItems.category, cast: 'text' },
  massKg: { expr: catalogueItems.massKg, cast: 'real' },
};

/** Built-in items (no organisation) and the organisation's own. */
const visibleTo = (organisationId: string) => or(isNull(catalogueItems.organisationId), eq(catalogueItems.organisationId, organisationId));

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

@Injectable()
export class CatalogueRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  async list(organisationId: string, query: CatalogueListQuery, executor: DbExecutor = this.db) {
    const page = keyset(SORTS[query.sort], catalogueItems.id, query);
    const where: (SQL | undefined)[] = [visibleTo(organisationId), page.after];
    if (query.category) where.push(inArray(catalogueItems.category, query.category));
    if (query.builtIn === true) where.push(isNull(catalogueItems.organisationId));
    if (query.builtIn === false) where.push(isNotNull(catalogueItems.organisationId));
    if (query.q) where.push(ilike(catalogueItems.name, `%${escapeLike(query.q)}%`));
    return executor
      .select({ row: catalogueItems, sortKey: page.sortKey })
      .from(catalogueItems)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  /** A built-in item or one of this organisation's. */
  async findVisible(organisationId: string, id: string, executor: DbExecutor = this.db, forUpdate = false): Promise<CatalogueItemRow | undefined> {
    const q = executor
      .select()
      .from(catalogueItems)
      .where(and(eq(catalogueItems.id, id), visibleTo(organisationId)));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row;
  }

  async insert(organisationId: string, values: CatalogueItemCreate, executor: DbExecutor = this.db): Promise<CatalogueItemRow> {
    const [row] = await executor
      .insert(catalogueItems)
      .values({ ...values, organisationId })
      .returning();
    return row;
  }

  async update(id: string, changes: Omit<CatalogueItemUpdate, 'version'>, executor: DbExecutor = this.db): Promise<CatalogueItemRow> {
    const [row] = await executor
      .update(catalogueItems)
      .set({ ...changes, version: sql`${catalogueItems.version} + 1`, updatedAt: sql`now()` })
      .where(eq(catalogueItems.id, id))
      .returning();
    return row;
  }

  async delete(id: string, executor: DbExecutor = this.db): Promise<void> {
    await executor.delete(catalogueItems).where(eq(catalogueItems.id, id));
  }
}
