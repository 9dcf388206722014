import { Inject, Injectable } from '@nestjs/common';
import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { scaffolds, findings, syncClients, syncClientVersions, syncConflicts, syncMutations, users } from '../db/schema/index.js';

export type SyncClientRow = typeof syncClients.$inferSelect;
export type SyncMutationLogRow = typeof syncMutations.$inferInsert;
export type SyncConflictRow = typeof syncConflicts.$inferSelect;
export type SyncConflictInsert = typeof syncConflicts.$inferInsert;

/**
 * The names of the users who wrote the conflicts' values, by id, in one query (a user of another
 * organisation, or one removed, is not visible under row-level security and goes unnamed).
 */
export async function conflictWriterNames(rows: readonly SyncConflictRow[], executor: DbExecutor): Promise<Map<string, string>> {
  const ids = [...new Set(rows.flatMap((r) => [r.winnerUserId, r.replacedUserId]).filter((id): id is string => id !== null))];
  if (!ids.length) return new Map();
  const named = await executor.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids));
  return new Map(named.map((u) => [u.id, u.name]));
}

/** Sync's own tables: clients and their counters, the outcome log, conflicts. */
@Injectable()
export class SyncRepository {
  constructor(@Inject(DRIZZLE) private readonly db: Db) {}

  /**
   * The client's row, locked until the push's transaction ends (made on its first push), so two
   * replicas handling pushes from one phone apply its mutations one batch after the other.
   */
  async lockClient(id: string, organisationId: string, userId: string, tx: DbExecutor): Promise<SyncClientRow> {
    await tx.insert(syncClients).values({ id, organisationId, userId }).onConflictDoNothing({ target: syncClients.id });
    const [row] = await tx.select().from(syncClients).where(eq(syncClients.id, id)).for('update');
    return row!;
  }

  /**
   * The client's row for a pull (made when the phone pulls before it ever pushed); undefined when
   * the id belongs to another user, whose record of versions this caller must not touch.
   */
  async clientOf(id: string, organisationId: string, userId: string, executor: DbExecutor = this.db): Promise<SyncClientRow | undefined> {
    await executor.insert(syncClients).values({ id, organisationId, userId }).onConflictDoNothing({ target: syncClients.id });
    const [row] = await executor.select().from(syncClients).where(eq(syncClients.id, id));
    return row && row.userId === userId && row.organisationId === organisationId ? row : undefined;
  }

  /** The highest version of each record handed to the client, by record id (absent: never handed). */
  async givenVersions(clientId: string, recordIds: string[], tx: DbExecutor): Promise<Map<string, number>> {
    if (!recordIds.length) return new Map();
    const rows = await tx
      .select({ recordId: syncClientVersions.recordId, version: syncClientVersions.version })
      .from(syncClientVersions)
      .where(and(eq(syncClientVersions.clientId, clientId), inArray(syncClientVersions.recordId, recordIds)));
    return new Map(rows.map((r) => [r.recordId, r.version]));
  }

  /** Notes the versions handed to the client (one statement; a version never goes down). */
  async recordGiven(clientId: string, records: { id: string; version: number }[], executor: DbExecutor = this.db): Promise<void> {
    const latest = new Map<string, number>();
    for (const r of records) latest.set(r.id, Math.max(r.version, latest.get(r.id) ?? 0));
    if (!latest.size) return;
    const json = JSON.stringify([...latest].map(([record_id, version]) => ({ client_id: clientId, record_id, version })));
    await executor.execute(sql`
      insert into sync_client_versions (client_id, record_id, version)
      select client_id, record_id, version from json_populate_recordset(null::sync_client_versions, ${json}::json)
      order by record_id
      on conflict (client_id, record_id) do update set version = greatest(sync_client_versions.version, excluded.version)`);
  }

  async advanceClient(id: string, lastMutationId: number, tx: DbExecutor): Promise<void> {
    await tx.update(syncClients).set({ lastMutationId, lastPushAt: sql`now()` }).where(eq(syncClients.id, id));
  }

  async loggedOutcomes(clientId: string, mutationIds: number[], tx: DbExecutor) {
    if (!mutationIds.length) return [];
    return tx
      .select()
      .from(syncMutations)
      .where(and(eq(syncMutations.clientId, clientId), inArray(syncMutations.mutationId, mutationIds)));
  }

  /** One statement whatever the batch size: the rows travel as one JSON parameter (thousands of bind parameters are slow to build and bind). */
  async logOutcomes(rows: SyncMutationLogRow[], tx: DbExecutor): Promise<void> {
    if (!rows.length) return;
    const json = JSON.stringify(
      rows.map((r) => ({
        client_id: r.clientId,
        mutation_id: r.mutationId,
        organisation_id: r.organisationId,
        entity: r.entity,
        entity_id: r.entityId,
        action: r.action,
        outcome: r.outcome,
        reason: r.reason ?? null,
      })),
    );
    await tx.execute(sql`
      insert into sync_mutations (client_id, mutation_id, organisation_id, entity, entity_id, action, outcome, reason)
      select client_id, mutation_id, organisation_id, entity, entity_id, action, outcome, reason
      from json_populate_recordset(null::sync_mutations, ${json}::json)`);
  }

  async insertConflicts(rows: SyncConflictInsert[], tx: DbExecutor): Promise<SyncConflictRow[]> {
    return rows.length ? tx.insert(syncConflicts).values(rows).returning() : [];
  }

  /** The conflicts each of `mutationIds` opened, by mutation id (one query for a whole replayed batch). */
  async conflictIdsOfMutations(clientId: string, mutationIds: number[], tx: DbExecutor): Promise<Map<number, string[]>> {
    const byMutation = new Map<number, string[]>();
    if (!mutationIds.length) return byMutation;
    const rows = await tx
      .select({ id: syncConflicts.id, mutationId: syncConflicts.mutationId })
      .from(syncConflicts)
      .where(and(eq(syncConflicts.winnerClientId, clientId), inArray(syncConflicts.mutationId, mutationIds)));
    for (const r of rows) byMutation.set(r.mutationId, [...(byMutation.get(r.mutationId) ?? []), r.id]);
    return byMutation;
  }

  /** Conflicts of the organisation, newest first; a foreman's list holds only findings in their scope. */
  async listConflicts(organisationId: string, filter: { status?: 'open' | 'resolved'; entityId?: string; limit: number; foremanId?: string }, executor: DbExecutor = this.db) {
    const where = [eq(syncConflicts.organisationId, organisationId)];
    if (filter.status) where.push(eq(syncConflicts.status, filter.status));
    if (filter.entityId) where.push(eq(syncConflicts.entityId, filter.entityId));
    if (filter.foremanId) {
      where.push(
        sql`${syncConflicts.entityId} in (select ${findings.id} from ${findings} join ${scaffolds} on ${scaffolds.id} = ${findings.scaffoldId}
          where ${scaffolds.foremanId} = ${filter.foremanId} or ${findings.assigneeId} = ${filter.foremanId})`,
      );
    }
    return executor.select().from(syncConflicts).where(and(...where)).orderBy(desc(syncConflicts.createdAt), desc(syncConflicts.id)).limit(filter.limit);
  }

  async findConflict(organisationId: string, id: string, tx: DbExecutor, forUpdate = false): Promise<SyncConflictRow | undefined> {
    const q = tx.select().from(syncConflicts).where(and(eq(syncConflicts.id, id), eq(syncConflicts.organisationId, organisationId)));
    const [row] = forUpdate ? await q.for('update') : await q;
    return row;
  }

  async markResolved(id: string, values: { resolution: string; resolvedBy: string }, tx: DbExecutor): Promise<SyncConflictRow> {
    const [row] = await tx
      .update(syncConflicts)
      .set({ status: 'resolved', resolution: values.resolution, resolvedBy: values.resolvedBy, resolvedAt: sql`now()` })
      .where(eq(syncConflicts.id, id))
      .returning();
    return row!;
  }
}
