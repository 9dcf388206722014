import { Inject, Injectable, Logger } from '@nestjs/common';
import { batchIsConsecutive, orderOfMutation, type SyncMutation, type SyncMutationResult, type SyncPush, type SyncPushResponse } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { inScope } from '../findings/finding-command-rules.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import { BatchFallback, BatchSyncStore } from './batch-sync-store.js';
import { faultAfter, faultPoint } from './fault-injection.js';
import { FindingSyncService, type MutationApplied } from './finding-sync.service.js';
import { RecordSyncService } from './record-sync.service.js';
import { type BatchFinding, SyncBatchRepository } from './sync-batch.repository.js';
import { isDatabaseError, isRetryable, pgCode, rejectionReason } from './mutation-rejected.js';
import { SyncPullRepository } from './sync-pull.repository.js';
import { toSyncFinding } from './sync.mapper.js';
import { SyncRepository, type SyncMutationLogRow } from './sync.repository.js';

/** Mutations per part written while the next part is computed (applyInMemory). */
const WRITE_PART = 250;
/** Mutations between two turns of the event loop while a batch is computed in memory. */
const YIELD_EVERY = 25;

/**
 * POST /api/sync/push: a phone's batch of mutations applied in ONE transaction, together with the
 * phone's counter (its row locked FOR UPDATE, so replicas cannot interleave two batches of one
 * phone). Replays are answered with their first outcome; a gap refuses the batch (409); a mutation
 * that can never apply is rejected with its reason inside a savepoint, and the counter moves on.
 * Nothing here reads a device clock.
 */
interface FreshOutcome {
  results: SyncMutationResult[];
  /** The touched findings as they stand at the end of the batch's savepoint (undefined: read them afterwards). */
  stored?: BatchFinding[];
}

@Injectable()
export class SyncPushService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly sync: SyncRepository,
    private readonly pull: SyncPullRepository,
    private readonly findingSync: FindingSyncService,
    private readonly recordSync: RecordSyncService,
    private readonly batch: SyncBatchRepository,
    private readonly audit: AuditService,
  ) {}

  private readonly logger = new Logger(SyncPushService.name);

  async push(user: AuthUser, body: SyncPush): Promise<SyncPushResponse> {
    const ids = body.mutations.map((m) => m.id);
    if (!batchIsConsecutive(ids)) {
      throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
        { path: ['mutations'], code: 'not_consecutive', message: 'Mutation ids must rise by one within a batch' },
      ]);
    }
    try {
      return faultAfter('sync-push:after-commit', await this.db.transaction((tx) => this.applyBatch(tx, user, body)));
    } catch (error) {
      if (isRetryable(error)) throw new AppError(ErrorCode.ServiceUnavailable, 'The server was busy with the same records; send the batch again');
      throw error;
    }
  }

  private async applyBatch(tx: DbExecutor, user: AuthUser, body: SyncPush): Promise<SyncPushResponse> {
    const client = await this.sync.lockClient(body.clientId, user.organisationId, user.userId, tx);
    if (client.userId !== user.userId || client.organisationId !== user.organisationId) {
      throw new AppError(ErrorCode.Forbidden, 'This sync client belongs to another user; sign in again on this device');
    }
    const first = body.mutations[0]!;
    const order = orderOfMutation(first.id, client.lastMutationId);
    if (order.kind === 'gap') {
      throw new AppError(ErrorCode.Conflict, `Mutation ids jump: expected ${order.expected} next`, [
        { path: ['mutations', 0, 'id'], code: 'mutation_gap', message: `expected ${order.expected}` },
      ]);
    }

    const replayed = body.mutations.filter((m) => m.id <= client.lastMutationId);
    const fresh = await this.checkedBaseVersions(tx, body.clientId, body.mutations.filter((m) => m.id > client.lastMutationId));
    const results: SyncMutationResult[] = [];
    const logged = new Map((await this.sync.loggedOutcomes(body.clientId, replayed.map((m) => m.id), tx)).map((r) => [r.mutationId, r]));
    const withConflicts = replayed.filter((m) => logged.get(m.id)?.outcome === 'conflict').map((m) => m.id);
    const conflictIdsOf = await this.sync.conflictIdsOfMutations(body.clientId, withConflicts, tx);
    for (const m of replayed) {
      const log = logged.get(m.id);
      const conflictIds = conflictIdsOf.get(m.id) ?? [];
      results.push({ id: m.id, outcome: log?.outcome ?? 'applied', reason: log?.reason ?? null, replayed: true, conflictIds });
    }

    const touched = [...new Set(body.mutations.map((m) => m.entityId))];
    const applied = fresh.length ? await this.applyFresh(tx, user, body.clientId, fresh, touched) : { results: [], stored: undefined };
    results.push(...applied.results);
    const logRows: SyncMutationLogRow[] = fresh.map((m, i) => ({
      clientId: body.clientId,
      mutationId: m.id,
      organisationId: user.organisationId,
      entity: m.entity,
      entityId: m.entityId,
      action: m.action,
      outcome: applied.results[i]!.outcome,
      reason: applied.results[i]!.reason,
    }));
    await this.sync.logOutcomes(logRows, tx);
    const lastMutationId = Math.max(client.lastMutationId, ...body.mutations.map((m) => m.id));
    if (lastMutationId !== client.lastMutationId) await this.sync.advanceClient(body.clientId, lastMutationId, tx);

    const records = (applied.stored ?? (await this.pull.findingsWithSite(touched, tx)))
      .filter((r) => r.finding.organisationId === user.organisationId)
      .filter((r) => inScope(user, r))
      .map((r) => toSyncFinding(r.finding, r.siteId));
    await this.sync.recordGiven(body.clientId, records, tx);
    faultPoint('sync-push:before-commit');
    return { lastMutationId, results, records };
  }

  /**
   * The server decides versions: a mutation's base version is never taken above the version of its
   * record the server has handed this phone (in a pull or a push answer), whatever number it sends.
   */
  private async checkedBaseVersions(tx: DbExecutor, clientId: string, fresh: SyncMutation[]): Promise<SyncMutation[]> {
    const given = await this.sync.givenVersions(clientId, [...new Set(fresh.filter((m) => m.baseVersion > 0).map((m) => m.entityId))], tx);
    return fresh.map((m) => {
      const handed = given.get(m.entityId);
      return handed !== undefined && m.baseVersion > handed ? { ...m, baseVersion: handed } : m;
    });
  }

  /**
   * The fresh mutations, in order. First in memory on the batch's findings loaded and locked up
   * front, written with a few multi-row statements inside one savepoint; when the database refuses
   * that write (a value it rejects, an id taken meanwhile) or stores it differently, back to the
   * savepoint and one savepoint per mutation instead, which records the offending one as rejected.
   */
  private async applyFresh(tx: DbExecutor, user: AuthUser, clientId: string, fresh: SyncMutation[], touched: string[]): Promise<FreshOutcome> {
    // Only a batch of findings alone is applied in memory; inspections, checks, scaffold tags and settings go one by one.
    if (fresh.every((m) => m.entity === 'finding')) {
      try {
        return await tx.transaction((sp) => this.applyInMemory(sp, user, clientId, fresh, touched));
      } catch (error) {
        if (!(error instanceof BatchFallback) && rejectionReason(error) === undefined) throw error;
        const why = error instanceof BatchFallback ? error.message : `the database refused a value (${pgCode(error)})`;
        this.logger.warn(`Push of ${fresh.length} mutations applied one by one: ${why}`);
      }
    }
    const scaffolds = new Map<string, ScaffoldRow>();
    const results: SyncMutationResult[] = [];
    for (const m of fresh) {
      const ctx = { user, clientId, mutationId: m.id };
      // A savepoint per mutation: a rejected one leaves no trace but its log row.
      const apply = (sp: DbExecutor) =>
        m.entity === 'finding' ? this.findingSync.apply(this.findingSync.dbStore(sp, user, scaffolds), ctx, m) : this.recordSync.apply(sp, ctx, m);
      results.push(await this.applyOne(m, () => tx.transaction(apply)));
    }
    return { results, stored: undefined };
  }

  /**
   * Inside the batch's savepoint: every mutation in memory, then a few multi-row writes, then the
   * written rows checked. A long batch is written in parts as it goes: while PostgreSQL stores one
   * part, the next is computed (the parts are written in order, on the one connection).
   */
  private async applyInMemory(sp: DbExecutor, user: AuthUser, clientId: string, fresh: SyncMutation[], touched: string[]): Promise<FreshOutcome> {
    const loaded = await this.batch.lockFindings(fresh.map((m) => m.entityId), sp);
    const store = new BatchSyncStore(this.findingSync.dbStore(sp, user, new Map()), user, loaded, await this.batch.now(sp));
    const results: SyncMutationResult[] = [];
    let writing: Promise<void> = Promise.resolve();
    const writeBehind = () => {
      const part = store.take();
      writing = writing.then(() => store.write(part, sp, this.batch, this.audit));
      // Awaited before anything else can fail on its account; meanwhile not an unhandled rejection.
      writing.catch(() => undefined);
    };
    for (const [i, m] of fresh.entries()) {
      store.begin();
      let result: SyncMutationResult;
      try {
        // A database error here has aborted the savepoint: it propagates, and the batch goes one by one.
        result = await this.applyOne(m, () => this.findingSync.apply(store, { user, clientId, mutationId: m.id }, m), true);
      } catch (error) {
        await writing; // a part that failed to write is the cause to report
        throw error;
      }
      if (result.outcome === 'rejected') store.rollback();
      results.push(result);
      if ((i + 1) % WRITE_PART === 0 && i + 1 < fresh.length) writeBehind();
      // Mutations in memory never wait for I/O: let the connection send and read meanwhile.
      if ((i + 1) % YIELD_EVERY === 0) await new Promise((resolve) => setImmediate(resolve));
    }
    writeBehind();
    await writing;
    if (!store.matchesStored()) throw new BatchFallback('a finding was stored differently');
    // The answer's records come from the rows in memory (loaded and locked here, or written and checked just now).
    const { found, missing } = store.current(touched);
    return { results, stored: [...found, ...(await this.pull.findingsWithSite(missing, sp))] };
  }

  /** The mutation's outcome; a mutation that can never apply is rejected with its reason. */
  private async applyOne(m: SyncMutation, apply: () => Promise<MutationApplied>, inMemory = false): Promise<SyncMutationResult> {
    try {
      return { id: m.id, ...(await apply()), replayed: false };
    } catch (error) {
      const reason = inMemory && isDatabaseError(error) ? undefined : rejectionReason(error);
      if (reason === undefined) throw error;
      return { id: m.id, outcome: 'rejected', reason, replayed: false, conflictIds: [] };
    }
  }
}
