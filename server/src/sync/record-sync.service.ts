import { Injectable } from '@nestjs/common';
import type { SyncMutation } from '@plummet/shared';
import type { DbExecutor } from '../db/db.tokens.js';
import { InspectionCommands } from '../inspections/inspection-commands.js';
import { ScaffoldCommands } from '../scaffolds/scaffold-commands.js';
import { UserSettingsCommands } from '../users/user-settings-commands.js';
import type { MutationApplied, SyncContext } from './finding-sync.service.js';
import { MutationRejected } from './mutation-rejected.js';

/**
 * The push's adapter for inspections, control checks, a scaffold's tag status and the user's
 * settings: a mutation runs as the same command a REST route runs (inspections/inspection-commands.ts,
 * scaffolds/scaffold-commands.ts, users/user-settings-commands.ts). A command's rejection (an AppError) becomes a rejected mutation
 * with the error's message as its reason; nothing here decides a rule.
 */
@Injectable()
export class RecordSyncService {
  constructor(
    private readonly inspections: InspectionCommands,
    private readonly scaffolds: ScaffoldCommands,
    private readonly settings: UserSettingsCommands,
  ) {}

  async apply(tx: DbExecutor, ctx: SyncContext, m: SyncMutation): Promise<MutationApplied> {
    const { outcome, reason, conflictIds } = await this.run(tx, ctx, m);
    return { outcome, reason, conflictIds };
  }

  private run(tx: DbExecutor, actor: SyncContext, m: SyncMutation): Promise<MutationApplied> {
    switch (`${m.entity}:${m.action}`) {
      case 'inspection:create':
        return this.inspections.create(tx, actor, { ...m.payload, id: m.entityId });
      case 'inspection:update':
        return this.inspections.edit(tx, actor, m.entityId, m.payload, m.baseVersion);
      case 'inspection:finish':
        return this.inspections.finish(tx, actor, m.entityId, m.payload);
      case 'control-check:put':
        return this.inspections.putControlCheck(tx, actor, m.entityId, m.payload, m.baseVersion);
      case 'scaffold:status':
        return this.scaffolds.changeStatus(tx, actor, m.entityId, m.payload, m.baseVersion);
      case 'user:update':
        return this.settings.edit(tx, actor, m.entityId, m.payload, m.baseVersion);
      default:
        throw new MutationRejected(`The server cannot apply "${m.action}" to a ${m.entity}`);
    }
  }
}
