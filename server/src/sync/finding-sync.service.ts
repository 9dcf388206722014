import { Injectable } from '@nestjs/common';
import type { SyncMutation } from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import type { DbExecutor } from '../db/db.tokens.js';
import type { CommandResult } from '../findings/finding-command-rules.js';
import { FindingCommands } from '../findings/finding-commands.js';
import type { FindingStore } from '../findings/finding-store.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import { MutationRejected } from './mutation-rejected.js';

export interface SyncContext {
  user: AuthUser;
  clientId: string;
  mutationId: number;
}

export interface MutationApplied {
  outcome: 'applied' | 'conflict';
  reason: string | null;
  conflictIds: string[];
}

/**
 * The push's adapter for findings: a mutation runs as the same command a REST route runs
 * (findings/finding-commands.ts). A command's rejection (an AppError) becomes a rejected mutation
 * with the error's message as its reason (mutation-rejected.ts); nothing here decides a rule.
 */
@Injectable()
export class FindingSyncService {
  constructor(private readonly commands: FindingCommands) {}

  /** Statement by statement on `tx`; `scaffolds` caches scaffolds across the mutations of one push. */
  dbStore(tx: DbExecutor, user: AuthUser, scaffolds?: Map<string, ScaffoldRow>): FindingStore {
    return this.commands.store(tx, user, scaffolds);
  }

  async apply(store: FindingStore, ctx: SyncContext, m: SyncMutation): Promise<MutationApplied> {
    const actor = { user: ctx.user, clientId: ctx.clientId, mutationId: ctx.mutationId };
    const { outcome, reason, conflictIds } = await this.run(store, actor, m);
    return { outcome, reason, conflictIds };
  }

  private run(store: FindingStore, actor: SyncContext, m: SyncMutation): Promise<CommandResult> {
    switch (m.action) {
      case 'create':
        return this.commands.create(store, actor, { ...m.payload, id: m.entityId });
      case 'update':
        return this.commands.edit(store, actor, m.entityId, m.payload, m.baseVersion);
      case 'state':
        return this.commands.changeState(store, actor, m.entityId, m.payload);
      case 'assign':
        return this.commands.assign(store, actor, m.entityId, m.payload);
      case 'hand-back':
        return this.commands.handBack(store, actor, m.entityId, m.payload);
      default:
        throw new MutationRejected(`The server cannot apply "${String(m.action)}" to a finding`);
    }
  }
}
