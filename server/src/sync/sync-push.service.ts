import { Inject, Injectable } from '@nestjs/common';
import { batchIsConsecutive, orderOfMutation, type SyncMutationResult, type SyncPush, type SyncPushResponse } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { inScope } from '../findings/findings.service.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import { FindingSyncService } from './finding-sync.service.js';
import { isRetryable, rejectionReason } from './mutation-rejected.js';
import { SyncPullRepository } from './sync-pull.repository.js';
import { toSyncFinding } from './sync.mapper.js';
import { SyncRepository, type SyncMutationLogRow } from './sync.repository.js';

/**
 * POST /api/sync/push: a phone's batch of mutations applied in ONE transaction, together with the
 * phone's counter (its row locked FOR UPDATE, so replicas cannot interleave two batches of one
 * phone). Replays are answered with their first outcome; a gap refuses the batch (409); a mutation
 * that can never apply is rejected with its reason inside a savepoint, and the counter moves on.
 * Nothing here reads a device clock.
 */
@Injectable()
export class SyncPushService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly sync: SyncRepository,
    private readonly pull: SyncPullRepository,
    private readonly findingSync: FindingSyncService,
  ) {}

  async push(user: AuthUser, body: SyncPush): Promise<SyncPushResponse> {
    const ids = body.mutations.map((m) => m.id);
    if (!batchIsConsecutive(ids)) {
      throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
        { path: ['mutations'], code: 'not_consecutive', message: 'Mutation ids must rise by one within a batch' },
      ]);
    }
    try {
      return await this.db.transaction((tx) => this.applyBatch(tx, user, body));
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
    const fresh = body.mutations.filter((m) => m.id > client.lastMutationId);
    const results: SyncMutationResult[] = [];
    const logged = new Map((await this.sync.loggedOutcomes(body.clientId, replayed.map((m) => m.id), tx)).map((r) => [r.mutationId, r]));
    for (const m of replayed) {
      const log = logged.get(m.id);
      const conflictIds = log?.outcome === 'conflict' ? await this.sync.conflictIdsOfMutation(body.clientId, m.id, tx) : [];
      results.push({ id: m.id, outcome: log?.outcome ?? 'applied', reason: log?.reason ?? null, replayed: true, conflictIds });
    }

    const logRows: SyncMutationLogRow[] = [];
    const scaffolds = new Map<string, ScaffoldRow>();
    for (const m of fresh) {
      const ctx = { user, clientId: body.clientId, mutationId: m.id, scaffolds };
      let result: SyncMutationResult;
      try {
        // A savepoint per mutation: a rejected one leaves no trace but its log row.
        const applied = await tx.transaction((sp) => this.findingSync.apply(sp, ctx, m));
        result = { id: m.id, ...applied, replayed: false };
      } catch (error) {
        const reason = rejectionReason(error);
        if (reason === undefined) throw error;
        result = { id: m.id, outcome: 'rejected', reason, replayed: false, conflictIds: [] };
      }
      results.push(result);
      logRows.push({
        clientId: body.clientId,
        mutationId: m.id,
        organisationId: user.organisationId,
        entity: m.entity,
        entityId: m.entityId,
        action: m.action,
        outcome: result.outcome,
        reason: result.reason,
      });
    }
    await this.sync.logOutcomes(logRows, tx);
    const lastMutationId = Math.max(client.lastMutationId, ...body.mutations.map((m) => m.id));
    if (lastMutationId !== client.lastMutationId) await this.sync.advanceClient(body.clientId, lastMutationId, tx);

    const touched = [...new Set(body.mutations.map((m) => m.entityId))];
    const records = (await this.pull.findingsWithSite(touched, tx))
      .filter((r) => r.finding.organisationId === user.organisationId)
      .filter((r) => inScope(user, r))
      .map((r) => toSyncFinding(r.finding, r.siteId));
    return { lastMutationId, results, records };
  }
}
