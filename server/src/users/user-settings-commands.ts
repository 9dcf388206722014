/**
 * THE place where a user's own profile and settings (name, position, display units) change, from
 * PATCH /users/me or a phone's push: merged field by field, each written field stamped with its
 * writer, a clash with a value the phone had not seen kept as a conflict, one audit event. Only the
 * user changes their own settings.
 */
import { Injectable } from '@nestjs/common';
import { type FieldStamps, mergeFieldPatch, UserProfileUpdateSchema } from '@plummet/shared';
import { AppError, ErrorCode } from '../common/app-error.js';
import { insertConflictRows, transactionNow } from '../common/command-writes.js';
import { type CommandActor, conflictReason, conflictRows, parseInput, seenVersion } from '../common/command-actor.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { UserSettingsRepository } from './user-settings.repository.js';
import { UsersRepository } from './users.repository.js';

export interface SettingsCommandResult {
  outcome: 'applied' | 'conflict';
  reason: string | null;
  conflictIds: string[];
}

@Injectable()
export class UserSettingsCommands {
  constructor(
    private readonly settings: UserSettingsRepository,
    private readonly users: UsersRepository,
  ) {}

  async edit(tx: DbExecutor, actor: CommandActor, userId: string, payload: unknown, baseVersion?: number): Promise<SettingsCommandResult> {
    const { user } = actor;
    if (userId !== user.userId) throw new AppError(ErrorCode.Forbidden, 'Only the user changes their own settings');
    const patch = parseInput(UserProfileUpdateSchema, payload);
    const current = await this.settings.lock(userId, tx);
    if (!current) throw AppError.notFound('User');
    const merge = mergeFieldPatch({
      current: current as unknown as Record<string, unknown>,
      stamps: (current.syncFields ?? {}) as FieldStamps,
      patch,
      baseVersion: seenVersion(actor, current.version, baseVersion),
      clientId: actor.clientId,
      nextVersion: current.version + 1,
      userId: user.userId,
      at: (await transactionNow(tx)).toISOString(),
    });
    if (!Object.keys(merge.changes).length && !merge.conflicts.length) return { outcome: 'applied', reason: 'Nothing to change', conflictIds: [] };
    if (Object.keys(merge.changes).length) await this.settings.update(userId, { ...merge.changes, syncFields: merge.stamps }, tx);
    const conflicts = await insertConflictRows(tx, conflictRows(actor, 'user', userId, merge.conflicts));
    const shown = (row: typeof current) => ({ name: row.name, position: row.position, units: row.units, windUnits: row.windUnits });
    await this.users.insertAudit(
      {
        organisationId: user.organisationId,
        actorId: user.userId,
        entityType: 'user',
        entityId: userId,
        action: 'profile-updated',
        before: shown(current),
        after: shown({ ...current, ...(merge.changes as Partial<typeof current>) }),
      },
      tx,
    );
    return conflicts.length
      ? { outcome: 'conflict', reason: conflictReason(merge.conflicts), conflictIds: conflicts.map((c) => c.id) }
      : { outcome: 'applied', reason: null, conflictIds: [] };
  }
}
