import { Inject, Injectable } from '@nestjs/common';
import {
  FindingUpdateSchema,
  settleConflict,
  type SyncConflict,
  type SyncConflictListQuery,
  type SyncConflictResolve,
} from '@plummet/shared';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { resolveItem } from '../findings/finding-input.js';
import { FindingsRepository } from '../findings/findings.repository.js';
import { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import { FindingCommands } from '../findings/finding-commands.js';
import { InspectionCommands } from '../inspections/inspection-commands.js';
import { ScaffoldCommands } from '../scaffolds/scaffold-commands.js';
import { UserSettingsCommands } from '../users/user-settings-commands.js';
import { toSyncConflict } from './sync.mapper.js';
import { conflictWriterNames, SyncRepository } from './sync.repository.js';

/** Conflicts kept by sync, listed and settled by inspectors and managers. */
@Injectable()
export class SyncConflictsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly sync: SyncRepository,
    private readonly findings: FindingsRepository,
    private readonly catalogue: CatalogueRepository,
    private readonly commands: FindingCommands,
    private readonly inspectionCommands: InspectionCommands,
    private readonly settingsCommands: UserSettingsCommands,
    private readonly scaffoldCommands: ScaffoldCommands,
  ) {}

  async list(user: AuthUser, query: SyncConflictListQuery): Promise<{ items: SyncConflict[] }> {
    const rows = await this.sync.listConflicts(user.organisationId, { ...query, foremanId: user.role === 'foreman' ? user.userId : undefined });
    const names = await conflictWriterNames(rows, this.db);
    return { items: rows.map((row) => toSyncConflict(row, names)) };
  }

  /**
   * Keep the current value (nothing written), put the replaced one back, or write a typed value
   * (checked like any edit: 400 naming the field). The write goes through the same per-field merge
   * as the server's own change (seen by definition, so it never opens a new conflict).
   */
  async resolve(user: AuthUser, id: string, input: SyncConflictResolve): Promise<SyncConflict> {
    return this.db.transaction(async (tx) => {
      const conflict = await this.sync.findConflict(user.organisationId, id, tx, true);
      if (!conflict) throw AppError.notFound('Conflict');
      if (conflict.status !== 'open') throw new AppError(ErrorCode.Conflict, 'The conflict is already settled');
      const settled = settleConflict(input.keep, conflict.replacedValue, input.value);
      const actor = { user, clientId: null, mutationId: null };
      if (settled.write && (conflict.entity === 'inspection' || conflict.entity === 'control-check')) {
        await this.inspectionCommands.settle(tx, actor, conflict.entity, conflict.entityId, conflict.field, settled.value);
      } else if (settled.write && conflict.entity === 'scaffold') {
        await this.scaffoldCommands.settle(tx, actor, conflict.entityId, conflict.field, settled.value);
      } else if (settled.write && conflict.entity === 'user') {
        await this.settingsCommands.edit(tx, actor, conflict.entityId, { [conflict.field]: settled.value });
      } else if (settled.write) {
        const scoped = await this.findings.findWithScope(user.organisationId, conflict.entityId, tx, true);
        if (!scoped) throw AppError.notFound('Finding');
        let value = settled.value;
        if (conflict.field === 'item' && input.keep === 'custom') {
          const parsed = FindingUpdateSchema.safeParse({ item: value });
          if (!parsed.success || !parsed.data.item) throw this.invalid(parsed.success ? 'An item is needed' : parsed.error.issues[0]!.message);
          const itemInput = parsed.data.item;
          const found = itemInput.catalogueItemId ? await this.catalogue.findVisible(user.organisationId, itemInput.catalogueItemId, tx) : undefined;
          value = resolveItem(itemInput, found);
        } else if (conflict.field !== 'item') {
          const parsed = FindingUpdateSchema.safeParse({ [conflict.field]: value });
          if (!parsed.success) throw this.invalid(parsed.error.issues[0]!.message);
          value = (parsed.data as Record<string, unknown>)[conflict.field];
        }
        // A server-side write has seen every value: it never opens a new conflict.
        await this.commands.writeFields(this.commands.store(tx, user), actor, scoped.finding, { [conflict.field]: value }, scoped.finding.version, 'resolve-conflict');
      }
      const resolved = await this.sync.markResolved(id, { resolution: input.keep, resolvedBy: user.userId }, tx);
      return toSyncConflict(resolved, await conflictWriterNames([resolved], tx));
    });
  }

  private invalid(message: string): AppError {
    return new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [{ path: ['value'], code: 'invalid_value', message }]);
  }
}
