/**
 * THE place where a scaffold's tag status changes on site, from POST /scaffolds/:id/status or a
 * phone's push: one role and scope check (an inspector, manager or admin of the scaffold's
 * organisation), the status merged per field with SCAFFOLD_MERGE_POLICIES (when two edits that had
 * not seen each other clash, the more restrictive tag stands and the other waits in a conflict that
 * names its writer), one audit event with the transition and its reason, one typed rejection
 * (AppError). The adapters (scaffolds.service.ts for REST, sync/record-sync.service.ts for push)
 * only translate. Finishing an inspection and recording an alteration or adverse weather write the
 * tag through seenTagWrite(), so a later push that had not seen it is a conflict too.
 */
import { Injectable } from '@nestjs/common';
import { type FieldConflict, type FieldStamps, mergeFieldPatch, SCAFFOLD_MERGE_POLICIES, ScaffoldStatusChangeSchema, type ScaffoldStatus } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import { AppError } from '../common/app-error.js';
import { insertConflictRows, transactionNow } from '../common/command-writes.js';
import { type CommandActor, conflictReason, conflictRows, parseInput, requireRole, seenVersion } from '../common/command-actor.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { type ScaffoldRow, toScaffold } from './scaffold.mapper.js';
import { ScaffoldsRepository } from './scaffolds.repository.js';

export interface ScaffoldCommandResult {
  /** `conflict`: applied, but a tag its writer had not seen clashed (kept as a conflict). */
  outcome: 'applied' | 'conflict';
  reason: string | null;
  conflictIds: string[];
  row: ScaffoldRow;
}

/** Who may set a scaffold's tag on site (the same roles as before the status travelled through push). */
export const TAG_SETTERS = ['inspector', 'manager', 'admin'] as const;

/**
 * A tag set on the server by a write that has seen the scaffold as it is (an inspection's recorded
 * tag, a trigger closing it): the changed status with its stamp, or nothing when it is the same.
 */
export function seenTagWrite(scaffold: ScaffoldRow, status: ScaffoldStatus, actor: CommandActor, at: Date): { status?: ScaffoldStatus; syncFields?: FieldStamps } {
  const merge = mergeFieldPatch({
    current: scaffold,
    stamps: (scaffold.syncFields ?? {}) as FieldStamps,
    patch: { status },
    baseVersion: scaffold.version,
    clientId: actor.clientId,
    nextVersion: scaffold.version + 1,
    userId: actor.user.userId,
    at: at.toISOString(),
  });
  return 'status' in merge.changes ? { status, syncFields: merge.stamps } : {};
}

@Injectable()
export class ScaffoldCommands {
  constructor(
    private readonly scaffolds: ScaffoldsRepository,
    private readonly audit: AuditService,
  ) {}

  /**
   * Sets the tag with its reason. A REST change has seen the scaffold as it is; a push's base version
   * is checked by seenVersion(). The same tag again still records its reason (a re-inspection that
   * confirms the tag is worth the trail). Written even when the stored (more restrictive) tag stood:
   * the new version carries it back to the phone through the feed.
   */
  async changeStatus(tx: DbExecutor, actor: CommandActor, id: string, payload: unknown, baseVersion?: number): Promise<ScaffoldCommandResult> {
    const { user } = actor;
    requireRole(user, TAG_SETTERS, 'Only inspectors and managers change a scaffold’s tag');
    const input = parseInput(ScaffoldStatusChangeSchema, payload);
    const current = await this.scaffolds.find(user.organisationId, id, tx, true);
    if (!current) throw AppError.notFound('Scaffold');
    const merge = mergeFieldPatch({
      current,
      stamps: (current.syncFields ?? {}) as FieldStamps,
      patch: { status: input.status },
      baseVersion: seenVersion(actor, current.version, baseVersion),
      clientId: actor.clientId,
      nextVersion: current.version + 1,
      userId: user.userId,
      at: (await transactionNow(tx)).toISOString(),
      policies: SCAFFOLD_MERGE_POLICIES,
    });
    const changes = merge.changes as { status?: ScaffoldStatus };
    const row = await this.scaffolds.update(id, { ...changes, syncFields: merge.stamps }, tx);
    const conflictIds = await this.keepConflicts(tx, actor, id, merge.conflicts);
    await this.audit.record(tx, user, {
      entityType: 'scaffold',
      entityId: id,
      action: 'status',
      before: toScaffold(current),
      after: { ...toScaffold(row), statusNote: input.note, transition: { from: current.status, to: row.status, asked: input.status } },
    });
    if (conflictIds.length) return { outcome: 'conflict', reason: conflictReason(merge.conflicts), conflictIds, row };
    const reason = changes.status === undefined ? 'The scaffold already had this tag: the reason is recorded' : null;
    return { outcome: 'applied', reason, conflictIds: [], row };
  }

  /** Settling a conflict on the tag writes the chosen value as a server-side change (it has seen every value). */
  async settle(tx: DbExecutor, actor: CommandActor, id: string, field: string, value: unknown): Promise<void> {
    await this.changeStatus(tx, actor, id, { [field]: value, note: 'Conflict settled' });
  }

  private async keepConflicts(tx: DbExecutor, actor: CommandActor, entityId: string, conflicts: FieldConflict[]): Promise<string[]> {
    const rows = await insertConflictRows(tx, conflictRows(actor, 'scaffold', entityId, conflicts));
    return rows.map((r) => r.id);
  }
}
