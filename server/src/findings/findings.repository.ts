import { Inject, Injectable } from '@nestjs/common';
import { and, eq, sql } from 'drizzle-orm';
import type { FindingListQuery } from '@plummet/shared';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { findings, fixes, scaffolds, verifications } from '../db/schema/index.js';
import { findingFilters } from './finding-filters.js';
import { FINDING_API_COLUMNS, type FindingRow } from './finding.mapper.js';

const SORTS: Record<FindingListQuery['sort'], SortKey> = {
  riskScore: { expr: findings.riskScore, cast: 'integer' },
  // No due time sorts after every due time.
  dueAt: { expr: sql`coalesce(${findings.dueAt}, 'infinity'::timestamptz)`, cast: 'timestamptz' },
  createdAt: { expr: findings.createdAt, cast: 'timestamptz' },
  updatedAt: { expr: findings.updatedAt, cast: 'timestamptz' },
  heightM: { expr: findings.heightM, cast: 'real' },
};

export type FindingInsert = Omit<typeof findings.$inferInsert, 'createdAt' | 'updatedAt' | 'version'>;
export type FindingChanges = Partial<Omit<FindingInsert, 'id' | 'organisationId' | 'createdBy'>>;

type ApiColumns = { [K in (typeof FINDING_API_COLUMNS)[number]]: (typeof findings)[K] };
const API_COLUMNS = Object.fromEntries(FINDING_API_COLUMNS.map((k) => [k, findings[k]])) as ApiColumns;

/** Lists carry the estimate without its long explanations (FindingEstimateSummarySchema); PostgreSQL trims it. */
const LIST_COLUMNS = {
  ...API_COLUMNS,
  estimate: sql<unknown>`${findings.estimate} - 'resolved' #- '{severity,basis}' #- '{likelihood,reasons}'`,
};

/** A finding with the foreman responsible for its scaffold (for a foreman's scope). */
export interface FindingWithScope {
  finding: FindingRow;
  scaffoldForemanId: string | null;
}

@Injectable()
export class FindingsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** `foremanId`: only findings on that foreman's scaffolds or assigned to them. */
  async list(organisationId: string, query: FindingListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    const page = keyset(SORTS[query.sort], findings.id, query);
    const where = [...findingFilters(organisationId, query, foremanId), page.after];
    return executor
      .select({ row: query.estimate === 'full' ? API_COLUMNS : LIST_COLUMNS, sortKey: page.sortKey })
      .from(findings)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  async findAnyOrg(id: string, executor: DbExecutor = this.db): Promise<FindingRow | undefined> {
    const [row] = await executor.select().from(findings).where(eq(findings.id, id));
    return row;
  }

  async findWithScope(organisationId: string, id: string, executor: DbExecutor = this.db, forUpdate = false): Promise<FindingWithScope | undefined> {
    const q = executor
      .select({ finding: findings, scaffoldForemanId: scaffolds.foremanId })
      .from(findings)
      .innerJoin(scaffolds, eq(scaffolds.id, findings.scaffoldId))
      .where(and(eq(findings.id, id), eq(findings.organisationId, organisationId)));
    const [row] = forUpdate ? await q.for('update', { of: findings }) : await q;
    return row;
  }

  async insertIfAbsent(values: FindingInsert, executor: DbExecutor = this.db): Promise<FindingRow | undefined> {
    const [row] = await executor.insert(findings).values(values).onConflictDoNothing({ target: findings.id }).returning();
    return row;
  }

  async update(id: string, changes: FindingChanges, executor: DbExecutor = this.db): Promise<FindingRow> {
    const [row] = await executor
      .update(findings)
      .set({ ...changes, version: sql`${findings.version} + 1`, updatedAt: sql`now()` })
      .where(eq(findings.id, id))
      .returning();
    return row;
  }

  async insertFix(values: typeof fixes.$inferInsert, executor: DbExecutor = this.db): Promise<void> {
    await executor.insert(fixes).values(values);
  }

  async insertVerification(values: typeof verifications.$inferInsert, executor: DbExecutor = this.db): Promise<void> {
    await executor.insert(verifications).values(values);
  }
}
