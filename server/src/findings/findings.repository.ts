import { Inject, Injectable } from '@nestjs/common';
import { and, asc, desc, eq, inArray, type SQL, sql } from 'drizzle-orm';
import { type FindingListQuery, NOTE_PREVIEW_MAX } from '@plummet/shared';
import { keyset, type SortKey } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { auditEvents, findings, fixes, organisations, photos, scaffolds, users, verifications } from '../db/schema/index.js';
import { findingFilters } from './finding-filters.js';
import {
  FINDING_API_COLUMNS,
  FINDING_EXPORT_COLUMNS,
  FINDING_LIST_COLUMNS,
  type FindingApiRow,
  type FindingExportRow,
  type FindingListRow,
  type FindingRow,
} from './finding.mapper.js';

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

/** A list row reads neither the estimate nor the whole note (FindingListItemSchema). */
const LIST_COLUMNS = {
  ...(Object.fromEntries(FINDING_LIST_COLUMNS.map((k) => [k, findings[k]])) as { [K in (typeof FINDING_LIST_COLUMNS)[number]]: (typeof findings)[K] }),
  notePreview: sql<string>`CASE WHEN char_length(${findings.notes}) > ${NOTE_PREVIEW_MAX} THEN left(${findings.notes}, ${NOTE_PREVIEW_MAX - 1}) || '…' ELSE ${findings.notes} END`,
};

/** An export row reads the estimate's impact energy alone, not the whole estimate. */
const EXPORT_COLUMNS = {
  ...(Object.fromEntries(FINDING_EXPORT_COLUMNS.map((k) => [k, findings[k]])) as { [K in (typeof FINDING_EXPORT_COLUMNS)[number]]: (typeof findings)[K] }),
  impactEnergyJ: sql<number>`(${findings.estimate} ->> 'impactEnergyJ')::float8`,
};

/** A finding with the foreman responsible for its scaffold (for a foreman's scope). */
export interface FindingWithScope {
  finding: FindingRow;
  scaffoldForemanId: string | null;
}

@Injectable()
export class FindingsRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /** `foremanId`: only findings on that foreman's scaffolds or assigned to them. Rows of the list (FindingListItemSchema). */
  async list(organisationId: string, query: FindingListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    return this.page(LIST_COLUMNS, organisationId, query, foremanId, executor) as Promise<{ row: FindingListRow; sortKey: string }[]>;
  }

  /** The same page as `list`, each finding whole (GET /findings?estimate=full, the export). */
  async listWhole(organisationId: string, query: FindingListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    return this.page(API_COLUMNS, organisationId, query, foremanId, executor) as Promise<{ row: FindingApiRow; sortKey: string }[]>;
  }

  /** The same page as `list`, as the CSV export writes it. */
  async listForExport(organisationId: string, query: FindingListQuery, foremanId?: string, executor: DbExecutor = this.db) {
    return this.page(EXPORT_COLUMNS, organisationId, query, foremanId, executor) as Promise<{ row: FindingExportRow; sortKey: string }[]>;
  }

  private page(columns: typeof LIST_COLUMNS | typeof EXPORT_COLUMNS | ApiColumns, organisationId: string, query: FindingListQuery, foremanId: string | undefined, executor: DbExecutor) {
    const page = keyset(SORTS[query.sort], findings.id, query);
    const where = [...findingFilters(organisationId, query, foremanId), page.after];
    return executor
      .select({ row: columns, sortKey: page.sortKey })
      .from(findings)
      .where(and(...where))
      .orderBy(...page.orderBy)
      .limit(page.fetch);
  }

  /** By id alone; row-level security shows only the organisation's own (another's shows up as a taken id on insert). */
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

  /** The organisation's stored settings (read with readOrganisationSettings). */
  async organisationSettings(organisationId: string, executor: DbExecutor = this.db): Promise<unknown> {
    const [row] = await executor.select({ settings: organisations.settings }).from(organisations).where(eq(organisations.id, organisationId));
    return row?.settings ?? {};
  }

  /** Who owns each of these photo ids already (any organisation): a photo belongs to one record only. */
  async photoOwners(ids: string[], executor: DbExecutor = this.db): Promise<{ id: string; ownerType: string; ownerId: string }[]> {
    if (!ids.length) return [];
    return executor.select({ id: photos.id, ownerType: photos.ownerType, ownerId: photos.ownerId }).from(photos).where(inArray(photos.id, ids));
  }

  /** Who made the latest fix of the finding (separation of duties). */
  async latestFixer(findingId: string, executor: DbExecutor = this.db): Promise<string | undefined> {
    const [row] = await executor
      .select({ fixedBy: fixes.fixedBy })
      .from(fixes)
      .where(eq(fixes.findingId, findingId))
      .orderBy(desc(fixes.fixedAt), desc(fixes.createdAt))
      .limit(1);
    return row?.fixedBy;
  }

  /**
   * An alteration changed the scaffold: it is marked altered and its inspection falls due now
   * ("inspection due before use", UK WAHR 2005 reg. 12(4)(b)).
   */
  async markScaffoldsAltered(scaffoldIds: string[], at: Date, executor: DbExecutor = this.db): Promise<void> {
    if (!scaffoldIds.length) return;
    await executor
      .update(scaffolds)
      .set({ alteredAt: at, nextDueAt: at, version: sql`${scaffolds.version} + 1`, updatedAt: sql`now()` })
      .where(inArray(scaffolds.id, scaffoldIds));
  }

  /** The audit events of one finding with the actor's name, oldest first (the finding's history). */
  async auditTrail(organisationId: string, findingId: string, executor: DbExecutor = this.db) {
    return executor
      .select({ action: auditEvents.action, at: auditEvents.at, actorId: auditEvents.actorId, actorName: users.name, before: auditEvents.before, after: auditEvents.after })
      .from(auditEvents)
      .leftJoin(users, eq(users.id, auditEvents.actorId))
      .where(and(eq(auditEvents.organisationId, organisationId), eq(auditEvents.entityType, 'finding'), eq(auditEvents.entityId, findingId)))
      .orderBy(asc(auditEvents.id));
  }
}
