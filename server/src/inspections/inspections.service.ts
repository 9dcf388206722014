import { Inject, Injectable } from '@nestjs/common';
import {
  type Control,
  type ControlCheck,
  type ControlCheckPut,
  type Inspection,
  type InspectionCreate,
  type InspectionDetail,
  type InspectionFinish,
  type InspectionListQuery,
  type InspectionUpdate,
  type ListResponse,
  nextInspectionDue,
} from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { scopedForeman } from '../common/foreman-scope.js';
import { toPage } from '../common/keyset.js';
import { DRIZZLE, type Db, type DbExecutor } from '../db/db.tokens.js';
import { ReportMailQueue } from '../mail/report-mail.queue.js';
import { toScaffold } from '../scaffolds/scaffold.mapper.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { type InspectionRow, toControlCheck, toInspection } from './inspection.mapper.js';
import { InspectionsRepository } from './inspections.repository.js';

const sameInstant = (a: Date | null, b: string | undefined) => b === undefined || (a !== null && a.getTime() === new Date(b).getTime());

/** Whether a repeated create carries the same body as the stored inspection (then it is a retry). */
function sameStart(row: InspectionRow, input: InspectionCreate, user: AuthUser): boolean {
  return (
    row.scaffoldId === input.scaffoldId &&
    row.reason === input.reason &&
    row.windSpeedMps === input.windSpeedMps &&
    row.inspectorId === user.userId &&
    sameInstant(row.startedAt, input.startedAt)
  );
}

function sameFinish(row: InspectionRow, input: InspectionFinish): boolean {
  const fields = ['reportFor', 'location', 'equipment', 'mattersGivingRisk', 'actionTaken', 'furtherAction', 'reporterName', 'reporterPosition'] as const;
  return fields.every((f) => row[f] === input[f]) && row.signature === input.signature && sameInstant(row.finishedAt, input.finishedAt);
}

@Injectable()
export class InspectionsService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly inspections: InspectionsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly audit: AuditService,
    private readonly reportMail: ReportMailQueue,
  ) {}

  async list(user: AuthUser, query: InspectionListQuery): Promise<ListResponse<Inspection>> {
    const rows = await this.inspections.list(user.organisationId, query, scopedForeman(user));
    return toPage(
      rows.map((r) => ({ ...r.row, sortKey: r.sortKey })),
      query,
      toInspection,
    );
  }

  async get(user: AuthUser, id: string): Promise<InspectionDetail> {
    const row = await this.inspections.find(user.organisationId, id);
    const foremanId = scopedForeman(user);
    if (!row || (foremanId && !(await this.scaffolds.inForemanScope(row.scaffoldId, foremanId)))) throw AppError.notFound('Inspection');
    const checks = await this.inspections.controlChecks(id);
    return { ...toInspection(row), controlChecks: checks.map(toControlCheck) };
  }

  /**
   * Idempotent by the phone's id: the same body again answers the stored inspection
   * (`created: false`); the id with another body is a conflict; another organisation's id is 404.
   */
  async create(user: AuthUser, input: InspectionCreate): Promise<{ inspection: Inspection; created: boolean }> {
    return this.db.transaction(async (tx) => {
      const existing = await this.inspections.findAnyOrg(input.id, tx);
      if (existing) return { inspection: this.retried(existing, input, user), created: false };
      if (!(await this.scaffolds.find(user.organisationId, input.scaffoldId, tx))) throw AppError.notFound('Scaffold');
      const row = await this.inspections.insertIfAbsent(
        {
          id: input.id,
          organisationId: user.organisationId,
          scaffoldId: input.scaffoldId,
          inspectorId: user.userId,
          reason: input.reason,
          windSpeedMps: input.windSpeedMps,
          startedAt: input.startedAt ? new Date(input.startedAt) : new Date(),
        },
        tx,
      );
      if (!row) {
        // A retry committed between our read and insert.
        const raced = await this.inspections.findAnyOrg(input.id, tx);
        // Taken by a row this organisation cannot see (row-level security): another organisation's.
        if (!raced) throw AppError.notFound('Inspection');
        return { inspection: this.retried(raced, input, user), created: false };
      }
      const inspection = toInspection(row);
      await this.audit.record(tx, user, { entityType: 'inspection', entityId: row.id, action: 'create', before: null, after: inspection });
      return { inspection, created: true };
    });
  }

  private retried(existing: InspectionRow, input: InspectionCreate, user: AuthUser): Inspection {
    if (existing.organisationId !== user.organisationId) throw AppError.notFound('Inspection');
    if (!sameStart(existing, input, user)) throw new AppError(ErrorCode.Conflict, 'An inspection with this id exists with other details');
    return toInspection(existing);
  }

  async update(user: AuthUser, id: string, input: InspectionUpdate): Promise<Inspection> {
    const { version, ...changes } = input;
    return this.db.transaction(async (tx) => {
      const current = await this.ownOpenInspection(user, id, tx);
      if (version !== undefined && version !== current.version) {
        throw new AppError(ErrorCode.Conflict, `The inspection changed since version ${version}; it is now at version ${current.version}`);
      }
      const inspection = toInspection(await this.inspections.update(id, changes, tx));
      await this.audit.record(tx, user, { entityType: 'inspection', entityId: id, action: 'update', before: toInspection(current), after: inspection });
      return inspection;
    });
  }

  /**
   * Signs off the statutory report and moves the scaffold's dates: last inspected at the finish,
   * next due by the site's regime. Finishing again with the same report is a harmless retry.
   */
  async finish(user: AuthUser, id: string, input: InspectionFinish): Promise<Inspection> {
    return this.db.transaction(async (tx) => {
      const current = await this.ownInspection(user, id, tx);
      if (current.finishedAt) {
        if (sameFinish(current, input)) return toInspection(current);
        throw new AppError(ErrorCode.Conflict, 'The inspection is already finished and signed');
      }
      const finishedAt = input.finishedAt ? new Date(input.finishedAt) : new Date();
      if (finishedAt.getTime() < current.startedAt.getTime()) {
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['finishedAt'], code: 'too_small', message: 'An inspection cannot finish before it started' },
        ]);
      }
      const { finishedAt: _ignored, ...report } = input;
      const inspection = toInspection(
        await this.inspections.update(id, { ...report, finishedAt, signedAt: input.signature ? finishedAt : null }, tx),
      );
      await this.audit.record(tx, user, { entityType: 'inspection', entityId: id, action: 'finish', before: toInspection(current), after: inspection });
      // In this transaction: the finish and its report e-mail commit together or not at all.
      await this.reportMail.enqueueInspectionReport(tx, id);

      const target = await this.scaffolds.findWithSite(user.organisationId, current.scaffoldId, tx);
      // An older inspection synced late must not move the scaffold's dates backwards.
      if (target && (!target.scaffold.lastInspectedAt || target.scaffold.lastInspectedAt < finishedAt)) {
        const nextDueAt = nextInspectionDue(finishedAt, target.site.regime, target.site.timeZone);
        const scaffold = toScaffold(await this.scaffolds.update(target.scaffold.id, { lastInspectedAt: finishedAt, nextDueAt }, tx));
        await this.audit.record(tx, user, {
          entityType: 'scaffold',
          entityId: scaffold.id,
          action: 'inspected',
          before: toScaffold(target.scaffold),
          after: scaffold,
        });
      }
      return inspection;
    });
  }

  async putControlCheck(user: AuthUser, id: string, control: Control, input: ControlCheckPut): Promise<ControlCheck> {
    return this.db.transaction(async (tx) => {
      await this.ownOpenInspection(user, id, tx);
      const before = await this.inspections.findControlCheck(id, control, tx);
      const check = toControlCheck(await this.inspections.upsertControlCheck(user.organisationId, id, control, input, tx));
      await this.audit.record(tx, user, {
        entityType: 'control-check',
        entityId: check.id,
        action: before ? 'update' : 'create',
        before: before ? toControlCheck(before) : null,
        after: check,
      });
      return check;
    });
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
    if (row.finishedAt) throw new AppError(ErrorCode.Conflict, 'The inspection is finished and signed; it can no longer change');
    return row;
  }
}
