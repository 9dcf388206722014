import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import {
  decideStateCommand,
  FINDING_SYNC_FIELDS,
  FindingCreateSchema,
  FindingStateChangeSchema,
  FindingUpdateSchema,
  type FieldStamps,
  type LikelihoodAnswers,
  mergeFieldPatch,
  type ShapeSpec,
  stampsOfCreate,
  type SyncMutation,
} from '@plummet/shared';
import type { ZodError } from 'zod';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { CatalogueRepository } from '../catalogue/catalogue.repository.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { checkPosition, type FindingFields, findingColumns, newFindingRow, resolveItem } from '../findings/finding-input.js';
import { type FindingRow, toFinding } from '../findings/finding.mapper.js';
import { FindingsRepository } from '../findings/findings.repository.js';
import { inScope } from '../findings/findings.service.js';
import { InspectionsRepository } from '../inspections/inspections.repository.js';
import type { ScaffoldRow } from '../scaffolds/scaffold.mapper.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { MutationRejected } from './mutation-rejected.js';
import { DbSyncStore, type SyncStore } from './sync-store.js';
import { SyncRepository } from './sync.repository.js';

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

const issuesOf = (error: ZodError) => error.issues.map((i) => `${i.path.join('.') || 'payload'}: ${i.message}`).join('; ');

/** The syncable fields of a stored finding, as a patch names them. */
export function findingFieldValues(row: FindingRow): FindingFields & { notes: string } {
  return {
    elevation: row.elevation,
    lift: row.lift,
    bay: row.bay,
    heightM: row.heightM,
    item: { catalogueItemId: row.catalogueItemId, name: row.itemName, massKg: row.massKg, shape: (row.shape as ShapeSpec | null) ?? null },
    exposure: row.exposure,
    likelihoodAnswers: row.likelihoodAnswers as LikelihoodAnswers,
    notes: row.notes,
  };
}

/**
 * Applies one finding mutation inside the push's transaction, with the findings feature's own
 * rules and helpers (position check, catalogue item, estimate recomputed with the shared physics,
 * audit event). Throws MutationRejected (or an AppError) for a mutation that can never apply.
 */
@Injectable()
export class FindingSyncService {
  constructor(
    private readonly findings: FindingsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly inspections: InspectionsRepository,
    private readonly catalogue: CatalogueRepository,
    private readonly audit: AuditService,
    private readonly sync: SyncRepository,
  ) {}

  /** Statement by statement on `tx`; `scaffolds` caches scaffolds across the mutations of one push. */
  dbStore(tx: DbExecutor, user: AuthUser, scaffolds?: Map<string, ScaffoldRow>): SyncStore {
    const { findings, scaffolds: scaffoldsRepo, inspections, catalogue, audit, sync } = this;
    return new DbSyncStore({ findings, scaffolds: scaffoldsRepo, inspections, catalogue, audit, sync }, tx, user, scaffolds);
  }

  async apply(tx: SyncStore, ctx: SyncContext, mutation: SyncMutation): Promise<MutationApplied> {
    switch (mutation.action) {
      case 'create':
        return this.create(tx, ctx, mutation);
      case 'update':
        return this.update(tx, ctx, mutation);
      case 'state':
        return this.changeState(tx, ctx, mutation);
      default:
        throw new MutationRejected(`The server cannot yet apply "${mutation.action}" to a finding`);
    }
  }

  private async create(tx: SyncStore, ctx: SyncContext, mutation: SyncMutation): Promise<MutationApplied> {
    const { user } = ctx;
    if (user.role !== 'inspector') throw new MutationRejected('Only inspectors record findings');
    const parsed = FindingCreateSchema.safeParse({ ...mutation.payload, id: mutation.entityId });
    if (!parsed.success) throw new MutationRejected(`Invalid finding: ${issuesOf(parsed.error)}`);
    const input = parsed.data;
    const scaffold = await tx.scaffold(input.scaffoldId);
    if (!scaffold) throw new MutationRejected('The scaffold does not exist');
    const wind = await this.inspectionWind(input.inspectionId, scaffold.id, tx, true);
    checkPosition(input, scaffold);
    const item = resolveItem(input.item, await this.catalogueItem(input.item.catalogueItemId, tx));
    const row = await tx.insertFinding({
      ...newFindingRow(user, input, item, scaffold.id, wind),
      syncFields: stampsOfCreate(FINDING_SYNC_FIELDS, ctx.clientId),
    });
    if (!row) throw new MutationRejected('A finding with this id already exists');
    await tx.audit({ entityType: 'finding', entityId: row.id, action: 'create', before: null, after: toFinding(row) });
    return { outcome: 'applied', reason: null, conflictIds: [] };
  }

  private async update(tx: SyncStore, ctx: SyncContext, mutation: SyncMutation): Promise<MutationApplied> {
    const { user } = ctx;
    if (user.role !== 'inspector') throw new MutationRejected('Only inspectors edit findings');
    const parsed = FindingUpdateSchema.safeParse(mutation.payload);
    if (!parsed.success) throw new MutationRejected(`Invalid change: ${issuesOf(parsed.error)}`);
    const { version: _version, item: itemInput, ...rest } = parsed.data;
    void _version;
    const scoped = await tx.finding(mutation.entityId);
    if (!scoped) throw new MutationRejected('The finding does not exist (deleted, or never reached the server)');
    const current = scoped.finding;
    const patch: Record<string, unknown> = { ...rest };
    if (itemInput) patch.item = resolveItem(itemInput, await this.catalogueItem(itemInput.catalogueItemId, tx));
    return this.writeFields(tx, ctx, current, patch, mutation.baseVersion, 'update');
  }

  /**
   * Merges `patch` into the finding field by field (shared mergeFieldPatch), recomputes the
   * estimate from the merged fields and keeps every replaced-but-unseen value as a conflict.
   * `clientId` null: a write made on the server (settling a conflict), seen by definition.
   */
  async writeFields(tx: SyncStore, ctx: SyncContext, current: FindingRow, patch: Record<string, unknown>, baseVersion: number, action: string): Promise<MutationApplied> {
    const before = findingFieldValues(current);
    const merge = mergeFieldPatch({
      current: before as unknown as Record<string, unknown>,
      stamps: (current.syncFields ?? {}) as FieldStamps,
      patch,
      baseVersion,
      clientId: ctx.clientId,
      nextVersion: current.version + 1,
    });
    if (!Object.keys(merge.changes).length) return { outcome: 'applied', reason: 'Nothing to change', conflictIds: [] };
    const fields = { ...before, ...merge.changes } as typeof before;
    const scaffold = await tx.scaffold(current.scaffoldId);
    if (!scaffold) throw new MutationRejected('The scaffold does not exist');
    checkPosition(fields, scaffold);
    const wind = await this.inspectionWind(current.inspectionId, scaffold.id, tx, false);
    const row = await tx.updateFinding(current.id, { ...findingColumns(fields, wind), notes: fields.notes, syncFields: merge.stamps });
    const conflicts = await tx.insertConflicts(
      merge.conflicts.map((c) => ({
        organisationId: ctx.user.organisationId,
        entity: 'finding',
        entityId: current.id,
        field: c.field,
        currentValue: c.currentValue ?? null,
        replacedValue: c.replacedValue ?? null,
        replacedVersion: c.replacedStamp.v,
        replacedClientId: c.replacedStamp.c,
        winnerClientId: ctx.clientId,
        winnerUserId: ctx.user.userId,
        mutationId: ctx.mutationId,
      })),
    );
    await tx.audit({ entityType: 'finding', entityId: current.id, action, before: toFinding(current), after: toFinding(row) });
    return conflicts.length
      ? { outcome: 'conflict', reason: `Replaced a value you had not seen: ${conflicts.map((c) => c.field).join(', ')}`, conflictIds: conflicts.map((c) => c.id) }
      : { outcome: 'applied', reason: null, conflictIds: [] };
  }

  private async changeState(tx: SyncStore, ctx: SyncContext, mutation: SyncMutation): Promise<MutationApplied> {
    const { user } = ctx;
    const parsed = FindingStateChangeSchema.safeParse(mutation.payload);
    if (!parsed.success) throw new MutationRejected(`Invalid state change: ${issuesOf(parsed.error)}`);
    const input = parsed.data;
    const scoped = await tx.finding(mutation.entityId);
    if (!scoped || !inScope(user, scoped)) throw new MutationRejected('The finding does not exist (deleted, or never reached the server)');
    const current = scoped.finding;
    const decision = decideStateCommand(current.state, input.to, user.role, inScope(user, scoped));
    if (decision.kind === 'noop') return { outcome: 'applied', reason: `Already ${input.to}: nothing to change`, conflictIds: [] };
    if (decision.kind === 'reject') throw new MutationRejected(decision.reason);
    const now = new Date();
    const base = { id: input.recordId ?? randomUUID(), organisationId: user.organisationId, findingId: current.id, note: input.note };
    const kind = decision.transition.kind;
    if (kind === 'fix') await tx.insertFix({ ...base, fixedBy: user.userId, fixedAt: now });
    if (kind === 'verify' || kind === 'reopen') {
      await tx.insertVerification({ ...base, verifiedBy: user.userId, verifiedAt: now, outcome: kind === 'verify' ? 'verified' : 'reopened' });
    }
    const row = await tx.updateFinding(current.id, { state: input.to, ...(kind === 'make-safe' ? { madeSafeNote: input.note } : {}) });
    await tx.audit({ entityType: 'finding', entityId: current.id, action: `state:${input.to}`, before: toFinding(current), after: toFinding(row) });
    return { outcome: 'applied', reason: null, conflictIds: [] };
  }

  private async inspectionWind(inspectionId: string | null, scaffoldId: string, tx: SyncStore, creating: boolean): Promise<number | null> {
    if (!inspectionId) return null;
    const inspection = await tx.inspection(inspectionId);
    if (!inspection) throw new MutationRejected('The inspection does not exist');
    if (creating && inspection.scaffoldId !== scaffoldId) throw new MutationRejected('The inspection is of another scaffold');
    if (creating && inspection.finishedAt) throw new MutationRejected('The inspection is finished and signed; record the finding in a new inspection');
    return inspection.windSpeedMps;
  }

  private async catalogueItem(id: string | undefined, tx: SyncStore) {
    return id === undefined ? undefined : tx.catalogueItem(id);
  }
}
