/**
 * THE place where an inspection and its control checks change. Every write, from a REST route or a
 * phone's push, runs one of these commands: start, edit (per-field merge), finish and sign, answer a
 * control check (made or merged per field). Each has one role and scope check (only the inspector
 * who carries the inspection out, until it is signed), writes one audit event and refuses with one
 * typed rejection (AppError; a signed inspection is INSPECTION_SIGNED). Finishing queues the report
 * e-mail in the same transaction. The adapters (inspections.service.ts for REST,
 * sync/inspection-sync.service.ts for push) only translate.
 */
import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import {
  CONTROL_CHECK_MERGE_POLICIES,
  CONTROL_CHECK_SYNC_FIELDS,
  ControlCheckPutSchema,
  ControlCheckSyncPutSchema,
  type FieldConflict,
  type FieldStamps,
  INSPECTION_MERGE_POLICIES,
  INSPECTION_SYNC_FIELDS,
  InspectionCreateSchema,
  type InspectionCreate,
  InspectionFinishSchema,
  type InspectionFinish,
  InspectionUpdateSchema,
  mergeFieldPatch,
  nextInspectionDue,
  stampsOfCreate,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { insertConflictRows, transactionNow } from '../common/command-writes.js';
import { type CommandActor, conflictReason, conflictRows, parseInput, requireRole, seenVersion } from '../common/command-actor.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { ReportMailQueue } from '../mail/report-mail.queue.js';
import { registerContextOf } from '../register/register-context.js';
import { RegisterRepository } from '../register/register.repository.js';
import { toScaffold } from '../scaffolds/scaffold.mapper.js';
import { seenTagWrite } from '../scaffolds/scaffold-commands.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { InspectionCommandRepository } from './inspection-command.repository.js';
import { type ControlCheckRow, type InspectionRow, toControlCheck, toInspection } from './inspection.mapper.js';
import { InspectionsRepository } from './inspections.repository.js';

export interface InspectionCommandResult<Row> {
  /** `conflict`: applied, but a value its writer had not seen clashed (kept as a conflict). */
  outcome: 'applied' | 'conflict';
  reason: string | null;
  conflictIds: string[];
  row: Row;
}

const done = <Row>(row: Row, reason: string | null = null): InspectionCommandResult<Row> => ({ outcome: 'applied', reason, conflictIds: [], row });

const sameInstant = (a: Date | null, b: string | undefined) => b === undefined || (a !== null && a.getTime() === new Date(b).getTime());

/** Whether a repeated start carries the same body as the stored inspection (then it is a retry). */
function sameStart(row: InspectionRow, input: InspectionCreate, user: AuthUser): boolean {
  return (
    row.scaffoldId === input.scaffoldId &&
    row.reason === input.reason &&
    row.windSpeedMps === input.windSpeedMps &&
    row.inspectorId === user.userId &&
    sameInstant(row.startedAt, input.startedAt)
  );
}

const REPORT_FIELDS = ['reportFor', 'location', 'equipment', 'mattersGivingRisk', 'actionTaken', 'furtherAction', 'reporterName', 'reporterPosition', 'tagStatus', 'restriction', 'accessTagsChanged'] as const;

function sameFinish(row: InspectionRow, input: InspectionFinish): boolean {
  return REPORT_FIELDS.every((f) => row[f] === input[f]) && row.signature === input.signature && sameInstant(row.finishedAt, input.finishedAt);
}

export const signedRejection = () => new AppError(ErrorCode.InspectionSigned, 'The inspection is finished and signed; it can no longer change');

@Injectable()
export class InspectionCommands {
  constructor(
    private readonly inspections: InspectionsRepository,
    private readonly writes: InspectionCommandRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly audit: AuditService,
    private readonly reportMail: ReportMailQueue,
    private readonly register: RegisterRepository,
  ) {}

  /**
   * Starts a walk with the phone's id. The same body again (a retry) changes nothing and answers the
   * stored inspection (`created: false`); another body under a taken id is a 409.
   */
  async create(tx: DbExecutor, actor: CommandActor, payload: unknown): Promise<InspectionCommandResult<InspectionRow> & { created: boolean }> {
    const { user } = actor;
    requireRole(user, ['inspector'], 'Only inspectors carry out inspections');
    const input = parseInput(InspectionCreateSchema, payload);
    const existing = await this.inspections.findAnyOrg(input.id, tx);
    if (existing) return { ...done(this.retried(existing, input, user), 'Already recorded: nothing to change'), created: false };
    if (!(await this.scaffolds.find(user.organisationId, input.scaffoldId, tx))) throw AppError.notFound('Scaffold');
    const now = await transactionNow(tx);
    const row = await this.inspections.insertIfAbsent(
      {
        id: input.id,
        organisationId: user.organisationId,
        scaffoldId: input.scaffoldId,
        inspectorId: user.userId,
        reason: input.reason,
        windSpeedMps: input.windSpeedMps,
        startedAt: input.startedAt ? new Date(input.startedAt) : now,
        syncFields: stampsOfCreate(INSPECTION_SYNC_FIELDS, actor.clientId, user.userId, now.toISOString()),
      },
      tx,
    );
    if (!row) {
      // A retry committed between our read and insert.
      const raced = await this.inspections.findAnyOrg(input.id, tx);
      // Taken by a row this organisation cannot see (row-level security): another organisation's.
      if (!raced) throw AppError.notFound('Inspection');
      return { ...done(this.retried(raced, input, user), 'Already recorded: nothing to change'), created: false };
    }
    await this.audit.record(tx, user, { entityType: 'inspection', entityId: row.id, action: 'create', before: null, after: toInspection(row) });
    return { ...done(row), created: true };
  }

  /**
   * The inspector's edit of the report drafts, merged field by field. A REST edit has seen the
   * inspection as it is (a stale `version` in its body is a 409); a push's base version is checked
   * by seenVersion().
   */
  async edit(tx: DbExecutor, actor: CommandActor, id: string, payload: unknown, baseVersion?: number): Promise<InspectionCommandResult<InspectionRow>> {
    requireRole(actor.user, ['inspector'], 'Only inspectors edit inspections');
    const { version, ...patch } = parseInput(InspectionUpdateSchema, payload);
    const current = await this.ownOpenInspection(actor.user, id, tx);
    const restVersion = actor.clientId === null ? (baseVersion ?? version) : undefined;
    if (restVersion !== undefined && restVersion !== current.version) {
      throw new AppError(ErrorCode.Conflict, `The inspection changed since version ${restVersion}; it is now at version ${current.version}`);
    }
    const merge = await this.merge(tx, actor, current, patch, seenVersion(actor, current.version, baseVersion), INSPECTION_MERGE_POLICIES);
    if (!Object.keys(merge.changes).length && !merge.conflicts.length) return done(current, 'Nothing to change');
    // Written even when the stored (safer) value stood: the new version carries it back to the phone through the feed.
    const row = await this.inspections.update(id, { ...merge.changes, syncFields: merge.stamps }, tx);
    const conflictIds = await this.keepConflicts(tx, actor, 'inspection', id, merge.conflicts);
    await this.audit.record(tx, actor.user, { entityType: 'inspection', entityId: id, action: 'update', before: toInspection(current), after: toInspection(row) });
    return this.answer(row, merge.conflicts, conflictIds);
  }

  /**
   * Signs off the statutory report and moves the scaffold's dates: last inspected at the finish,
   * next due by the site's regime. The report e-mail is queued in this transaction, so the finish
   * and its e-mail commit together or not at all. Finishing again with the same report is a retry.
   */
  async finish(tx: DbExecutor, actor: CommandActor, id: string, payload: unknown): Promise<InspectionCommandResult<InspectionRow>> {
    const { user } = actor;
    requireRole(user, ['inspector'], 'Only inspectors finish inspections');
    const input = parseInput(InspectionFinishSchema, payload);
    const current = await this.ownInspection(user, id, tx);
    if (current.finishedAt) {
      if (sameFinish(current, input)) return done(current, 'Already finished: nothing to change');
      throw signedRejection();
    }
    const finishedAt = input.finishedAt ? new Date(input.finishedAt) : await transactionNow(tx);
    if (finishedAt.getTime() < current.startedAt.getTime()) {
      throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
        { path: ['finishedAt'], code: 'too_small', message: 'An inspection cannot finish before it started' },
      ]);
    }
    const { finishedAt: _ignored, ...report } = input;
    const row = await this.inspections.update(id, { ...report, finishedAt, signedAt: input.signature ? finishedAt : null }, tx);
    await this.audit.record(tx, user, { entityType: 'inspection', entityId: id, action: 'finish', before: toInspection(current), after: toInspection(row) });
    await this.reportMail.enqueueInspectionReport(tx, id);

    const target = await this.scaffolds.findWithSite(user.organisationId, current.scaffoldId, tx);
    // An older inspection synced late must not move the scaffold's dates backwards.
    if (target && (!target.scaffold.lastInspectedAt || target.scaffold.lastInspectedAt < finishedAt)) {
      const context = registerContextOf(target.site, target.scaffold);
      const nextDueAt = nextInspectionDue(finishedAt, context.regime, context.timeZone);
      // The tag status the inspector recorded becomes the scaffold's (none recorded: it stays as it
      // was), stamped as a write of the field, so a later push that had not seen it is a conflict.
      const status = input.tagStatus ? seenTagWrite(target.scaffold, input.tagStatus, actor, await transactionNow(tx)) : {};
      const scaffold = toScaffold(await this.scaffolds.update(target.scaffold.id, { lastInspectedAt: finishedAt, nextDueAt, ...status }, tx));
      await this.audit.record(tx, user, { entityType: 'scaffold', entityId: scaffold.id, action: 'inspected', before: toScaffold(target.scaffold), after: scaffold });
    }
    // Alterations and adverse weather recorded before the signature are answered by it.
    await this.register.answerTriggers(current.scaffoldId, id, finishedAt, tx);
    return done(row);
  }

  /**
   * Answers one control of an open inspection: a first answer makes the check (with the phone's id
   * when given), a later one merges result and note field by field. Through REST the body is the
   * whole answer; through push it names the inspection and control and any fields it changes.
   */
  async putControlCheck(tx: DbExecutor, actor: CommandActor, checkId: string | undefined, payload: unknown, baseVersion?: number): Promise<InspectionCommandResult<ControlCheckRow>> {
    const { user } = actor;
    requireRole(user, ['inspector'], 'Only inspectors answer control checks');
    const input = parseInput(ControlCheckSyncPutSchema, payload);
    await this.ownOpenInspection(user, input.inspectionId, tx);
    const existing = await this.writes.lockControlCheck(input.inspectionId, input.control, tx);
    if (!existing) {
      const first = parseInput(ControlCheckPutSchema, { result: input.result, note: input.note });
      const now = await transactionNow(tx);
      const row = await this.writes.insertControlCheck(
        {
          id: checkId ?? randomUUID(),
          organisationId: user.organisationId,
          inspectionId: input.inspectionId,
          control: input.control,
          result: first.result,
          note: first.note,
          syncFields: stampsOfCreate(CONTROL_CHECK_SYNC_FIELDS, actor.clientId, user.userId, now.toISOString()),
        },
        tx,
      );
      if (!row) throw new AppError(ErrorCode.Conflict, 'The control check id is taken');
      await this.audit.record(tx, user, { entityType: 'control-check', entityId: row.id, action: 'create', before: null, after: toControlCheck(row) });
      return done(row);
    }
    const patch = { ...(input.result !== undefined ? { result: input.result } : {}), ...(input.note !== undefined ? { note: input.note } : {}) };
    const merge = await this.merge(tx, actor, existing, patch, seenVersion(actor, existing.version, baseVersion), CONTROL_CHECK_MERGE_POLICIES);
    const changes = merge.changes as { result?: ControlCheckRow['result']; note?: string };
    if (!Object.keys(changes).length && !merge.conflicts.length) return done(existing, 'Nothing to change');
    // Written even when the stored (safer) value stood: the new version carries it back to the phone through the feed.
    const row = await this.writes.updateControlCheck(existing.id, { ...changes, syncFields: merge.stamps }, tx);
    const conflictIds = await this.keepConflicts(tx, actor, 'control-check', existing.id, merge.conflicts);
    await this.audit.record(tx, user, { entityType: 'control-check', entityId: existing.id, action: 'update', before: toControlCheck(existing), after: toControlCheck(row) });
    return this.answer(row, merge.conflicts, conflictIds);
  }

  /**
   * Settling a conflict on an inspection or control check writes the chosen value as a server-side
   * edit (it has seen every value): the same command, with the same role, scope and signed rule.
   */
  async settle(tx: DbExecutor, actor: CommandActor, entity: 'inspection' | 'control-check', id: string, field: string, value: unknown): Promise<void> {
    if (entity === 'inspection') {
      await this.edit(tx, actor, id, { [field]: value });
      return;
    }
    const check = await this.writes.findControlCheck(actor.user.organisationId, id, tx);
    if (!check) throw AppError.notFound('Control check');
    await this.putControlCheck(tx, actor, check.id, { inspectionId: check.inspectionId, control: check.control, [field]: value });
  }

  private async merge(
    tx: DbExecutor,
    actor: CommandActor,
    current: { version: number; syncFields: unknown } & Record<string, unknown>,
    patch: Record<string, unknown>,
    baseVersion: number,
    policies: typeof INSPECTION_MERGE_POLICIES,
  ) {
    return mergeFieldPatch({
      current,
      stamps: (current.syncFields ?? {}) as FieldStamps,
      patch,
      baseVersion,
      clientId: actor.clientId,
      nextVersion: current.version + 1,
      userId: actor.user.userId,
      at: (await transactionNow(tx)).toISOString(),
      policies,
    });
  }

  private async keepConflicts(tx: DbExecutor, actor: CommandActor, entity: 'inspection' | 'control-check', entityId: string, conflicts: FieldConflict[]): Promise<string[]> {
    const rows = await insertConflictRows(tx, conflictRows(actor, entity, entityId, conflicts));
    return rows.map((r) => r.id);
  }

  private answer<Row>(row: Row, conflicts: FieldConflict[], conflictIds: string[]): InspectionCommandResult<Row> {
    return conflictIds.length ? { outcome: 'conflict', reason: conflictReason(conflicts), conflictIds, row } : done(row);
  }

  private retried(existing: InspectionRow, input: InspectionCreate, user: AuthUser): InspectionRow {
    if (existing.organisationId !== user.organisationId) throw AppError.notFound('Inspection');
    if (!sameStart(existing, input, user)) throw new AppError(ErrorCode.Conflict, 'An inspection with this id exists with other details');
    return existing;
  }

  /** The inspection, locked; only the inspector who carries it out may change it (403 otherwise). */
  private async ownInspection(user: AuthUser, id: string, tx: DbExecutor): Promise<InspectionRow> {
    const row = await this.inspections.find(user.organisationId, id, tx, true);
    if (!row) throw AppError.notFound('Inspection');
    if (row.inspectorId !== user.userId) throw new AppError(ErrorCode.Forbidden, 'Only the inspector who carries out an inspection may change it');
    return row;
  }

  private async ownOpenInspection(user: AuthUser, id: string, tx: DbExecutor): Promise<InspectionRow> {
    const row = await this.ownInspection(user, id, tx);
    if (row.finishedAt) throw signedRejection();
    return row;
  }
}
