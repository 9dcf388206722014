/**
 * THE place where a finding is changed. Every write of a finding, from a REST route or from a
 * phone's push, runs one of these commands: create, edit (per-field merge), state change, assign,
 * hand back. Each has one role and scope check, writes one audit event (with the transition for a
 * state change) and refuses with one typed rejection (AppError). The adapters
 * (findings.service.ts for REST, sync/finding-sync.service.ts for push) only translate.
 */
import { Injectable } from '@nestjs/common';
import {
  FINDING_MERGE_POLICIES,
  FINDING_SYNC_FIELDS,
  FindingCreateSchema,
  FindingUpdateSchema,
  type FieldStamps,
  fixDueAt,
  mergeFieldPatch,
  stampsOfCreate,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { InspectionsRepository } from '../inspections/inspections.repository.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import { ReportMailQueue } from '../mail/report-mail.queue.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { applied, type CommandActor, type CommandResult, findingNotFound, parseInput, requireRole } from './finding-command-rules.js';
import { checkPosition, findingColumns, findingFieldValues, newFindingRow, resolveItem, sameCreate } from './finding-input.js';
import { type FindingRow, toFinding } from './finding.mapper.js';
import { assignFinding, changeFindingState, handBackFinding } from './finding-state-commands.js';
import { DbFindingStore, type FindingStore } from './finding-store.js';
import { FindingsRepository } from './findings.repository.js';

import { conflictReason, conflictRows, seenVersion } from '../common/command-actor.js';

@Injectable()
export class FindingCommands {
  constructor(
    private readonly findings: FindingsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly inspections: InspectionsRepository,
    private readonly catalogue: CatalogueRepository,
    private readonly audit: AuditService,
    private readonly reportMail: ReportMailQueue,
  ) {}

  /** Statement by statement on `tx`; `scaffolds` caches scaffolds across the mutations of one push. */
  store(tx: DbExecutor, user: AuthUser, scaffolds?: Map<string, ScaffoldRow>): FindingStore {
    const { findings, scaffolds: scaffoldsRepo, inspections, catalogue, audit, reportMail } = this;
    return new DbFindingStore({ findings, scaffolds: scaffoldsRepo, inspections, catalogue, audit, reportMail }, tx, user, scaffolds);
  }

  /**
   * Records a finding with the phone's id. The same body again (a retry) changes nothing and
   * answers the stored finding (`created: false`); another body under a taken id is a 409.
   * The due time of the fix follows from the band and the organisation's settings.
   */
  async create(store: FindingStore, actor: CommandActor, payload: unknown): Promise<CommandResult & { created: boolean }> {
    const { user } = actor;
    requireRole(user, ['inspector'], 'Only inspectors record findings');
    const input = parseInput(FindingCreateSchema, payload);
    const existing = await store.findingAnyOrg(input.id);
    if (existing) return { ...applied(retried(existing, input, user), 'Already recorded: nothing to change'), created: false };
    const scaffold = await store.scaffold(input.scaffoldId);
    if (!scaffold) throw AppError.notFound('Scaffold');
    const wind = await inspectionWind(store, input.inspectionId, scaffold.id, true);
    checkPosition(input, scaffold);
    const item = resolveItem(input.item, input.item.catalogueItemId === undefined ? undefined : await store.catalogueItem(input.item.catalogueItemId));
    const values = newFindingRow(user, input, item, scaffold.id, wind);
    const dueAt = fixDueAt(values.riskBand, await store.now(), await store.settings(), scaffold.nextDueAt);
    const now = await store.now();
    const row = await store.insertFinding({ ...values, dueAt, syncFields: stampsOfCreate(FINDING_SYNC_FIELDS, actor.clientId, user.userId, now.toISOString()) });
    if (!row) {
      const raced = await store.findingAnyOrg(input.id);
      // Taken by a row this organisation cannot see (row-level security): another organisation's, as before.
      if (!raced) throw AppError.notFound('Finding');
      return { ...applied(retried(raced, input, user), 'Already recorded: nothing to change'), created: false };
    }
    await store.audit({ entityType: 'finding', entityId: row.id, action: 'create', before: null, after: toFinding(row) });
    return { ...applied(row), created: true };
  }

  /**
   * An inspector's edit, merged field by field. `baseVersion` is the version the writer saw: a REST
   * edit has seen the finding as it is (a stale `version` in its body is a 409); a push's base
   * version is never taken above the finding's own version (a high number cannot hide a conflict).
   */
  async edit(store: FindingStore, actor: CommandActor, id: string, payload: unknown, baseVersion?: number): Promise<CommandResult> {
    requireRole(actor.user, ['inspector'], 'Only inspectors edit findings');
    const { version, item: itemInput, ...rest } = parseInput(FindingUpdateSchema, payload);
    const scoped = await store.finding(id);
    if (!scoped) throw findingNotFound();
    const current = scoped.finding;
    const restVersion = actor.clientId === null ? (baseVersion ?? version) : undefined;
    if (restVersion !== undefined && restVersion !== current.version) {
      throw new AppError(ErrorCode.Conflict, `The finding changed since version ${restVersion}; it is now at version ${current.version}`);
    }
    const patch: Record<string, unknown> = { ...rest };
    if (itemInput) {
      patch.item = resolveItem(itemInput, itemInput.catalogueItemId === undefined ? undefined : await store.catalogueItem(itemInput.catalogueItemId));
    }
    const seen = seenVersion(actor, current.version, baseVersion);
    return this.writeFields(store, actor, current, patch, seen, 'update');
  }

  /**
   * Merges `patch` into the finding field by field (shared mergeFieldPatch), recomputes the
   * estimate from the merged fields (and the due time when the band changes), stamps each written
   * field with the version and writer, and keeps every replaced-but-unseen value as a conflict.
   */
  async writeFields(store: FindingStore, actor: CommandActor, current: FindingRow, patch: Record<string, unknown>, baseVersion: number, action: string): Promise<CommandResult> {
    const before = findingFieldValues(current);
    const merge = mergeFieldPatch({
      current: before as unknown as Record<string, unknown>,
      stamps: (current.syncFields ?? {}) as FieldStamps,
      patch,
      baseVersion,
      clientId: actor.clientId,
      nextVersion: current.version + 1,
      userId: actor.user.userId,
      at: (await store.now()).toISOString(),
      policies: FINDING_MERGE_POLICIES,
    });
    if (!Object.keys(merge.changes).length && !merge.conflicts.length) return applied(current, 'Nothing to change');
    const fields = { ...before, ...merge.changes } as typeof before;
    const scaffold = await store.scaffold(current.scaffoldId);
    if (!scaffold) throw AppError.notFound('Scaffold');
    checkPosition(fields, scaffold);
    const wind = await inspectionWind(store, current.inspectionId, scaffold.id, false);
    const columns = findingColumns(fields, wind);
    const dueAt = columns.riskBand === current.riskBand ? undefined : fixDueAt(columns.riskBand, current.createdAt, await store.settings(), scaffold.nextDueAt);
    const row = Object.keys(merge.changes).length
      ? await store.updateFinding(current.id, { ...columns, notes: fields.notes, syncFields: merge.stamps, ...(dueAt !== undefined ? { dueAt } : {}) })
      : current;
    const conflicts = await store.insertConflicts(
      conflictRows(actor, 'finding', current.id, merge.conflicts),
    );
    await store.audit({ entityType: 'finding', entityId: current.id, action, before: toFinding(current), after: toFinding(row) });
    return conflicts.length
      ? { outcome: 'conflict', reason: conflictReason(merge.conflicts), conflictIds: conflicts.map((c) => c.id), row }
      : applied(row);
  }

  /** open → made safe → fixed → verified, and reopen (finding-state-commands.ts). */
  changeState(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
    return changeFindingState(store, actor, id, payload);
  }

  /** Hands the finding to a foreman of the organisation (the one place an assignment happens). */
  assign(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
    return assignFinding(store, actor, id, payload);
  }

  handBack(store: FindingStore, actor: CommandActor, id: string, payload: unknown): Promise<CommandResult> {
    return handBackFinding(store, actor, id, payload);
  }
}

function retried(existing: FindingRow, input: Parameters<typeof sameCreate>[1], user: AuthUser): FindingRow {
  if (existing.organisationId !== user.organisationId) throw AppError.notFound('Finding');
  if (!sameCreate(existing, input)) throw new AppError(ErrorCode.Conflict, 'A finding with this id exists with other details');
  return existing;
}

/** The wind of the finding's inspection (for the drift); a new finding's inspection must be of its scaffold and still open. */
async function inspectionWind(store: FindingStore, inspectionId: string | null, scaffoldId: string, creating: boolean): Promise<number | null> {
  if (!inspectionId) return null;
  const inspection = await store.inspection(inspectionId);
  if (!inspection) throw AppError.notFound('Inspection');
  if (creating) {
    if (inspection.scaffoldId !== scaffoldId) {
      throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
        { path: ['inspectionId'], code: 'other_scaffold', message: 'The inspection is of another scaffold' },
      ]);
    }
    if (inspection.finishedAt) throw new AppError(ErrorCode.Conflict, 'The inspection is finished and signed; record the finding in a new inspection');
  }
  return inspection.windSpeedMps;
}
