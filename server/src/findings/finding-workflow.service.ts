import { randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { checkFindingTransition, type Finding, type FindingAssign, type FindingStateChange } from '@plummet/shared';
import { AuditService } from '../audit/audit.service.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { DRIZZLE, type Db } from '../db/db.tokens.js';
import { ReportMailQueue } from '../mail/report-mail.queue.js';
import { ScaffoldsRepository } from '../scaffolds/scaffolds.repository.js';
import { toFinding } from './finding.mapper.js';
import { FindingsRepository } from './findings.repository.js';
import { FindingsService, inScope } from './findings.service.js';

const isUniqueViolation = (error: unknown) => (error as { code?: string; cause?: { code?: string } })?.code === '23505' || (error as { cause?: { code?: string } })?.cause?.code === '23505';

/** Moves findings along open → made safe → fixed → verified (shared/src/findings/finding-state.ts) and hands them to foremen. */
@Injectable()
export class FindingWorkflowService {
  constructor(
    @Inject(DRIZZLE) private readonly db: Db,
    private readonly findings: FindingsRepository,
    private readonly scaffolds: ScaffoldsRepository,
    private readonly findingsService: FindingsService,
    private readonly audit: AuditService,
    private readonly reportMail: ReportMailQueue,
  ) {}

  /**
   * The new state with what it records: a fix writes a `fixes` row, a verify or reopen a
   * `verifications` row, making safe keeps the note on the finding. One transaction with the audit event.
   */
  async changeState(user: AuthUser, id: string, input: FindingStateChange): Promise<Finding> {
    try {
      return await this.db.transaction(async (tx) => {
        const scoped = await this.findingsService.visible(user, id, tx, true);
        const current = scoped.finding;
        const check = checkFindingTransition(current.state, input.to, user.role, inScope(user, scoped));
        if (!check.ok) {
          if (check.reason === 'role') throw new AppError(ErrorCode.Forbidden, `Your role cannot move a finding from ${current.state} to ${input.to}`);
          if (check.reason === 'scope') throw AppError.notFound('Finding');
          throw new AppError(ErrorCode.Conflict, `A finding cannot move from ${current.state} to ${input.to}`);
        }
        const now = new Date();
        const recordId = input.recordId ?? randomUUID();
        const base = { id: recordId, organisationId: user.organisationId, findingId: id, note: input.note };
        switch (check.transition.kind) {
          case 'fix':
            await this.findings.insertFix({ ...base, fixedBy: user.userId, fixedAt: now }, tx);
            break;
          case 'verify':
          case 'reopen':
            await this.findings.insertVerification(
              { ...base, verifiedBy: user.userId, verifiedAt: now, outcome: check.transition.kind === 'verify' ? 'verified' : 'reopened' },
              tx,
            );
            break;
          case 'make-safe':
            break;
        }
        const row = await this.findings.update(id, { state: input.to, ...(check.transition.kind === 'make-safe' ? { madeSafeNote: input.note } : {}) }, tx);
        const finding = toFinding(row);
        await this.audit.record(tx, user, {
          entityType: 'finding',
          entityId: id,
          action: `state:${input.to}`,
          before: toFinding(current),
          after: { ...finding, transition: { kind: check.transition.kind, note: input.note, recordId: check.transition.kind === 'make-safe' ? null : recordId } },
        });
        return finding;
      });
    } catch (error) {
      if (isUniqueViolation(error)) throw new AppError(ErrorCode.Conflict, 'The record id of this change is already used');
      throw error;
    }
  }

  /** The assignee must be a foreman of the organisation (400 naming assigneeId); null takes it back. */
  async assign(user: AuthUser, id: string, input: FindingAssign): Promise<Finding> {
    return this.db.transaction(async (tx) => {
      const { finding: current } = await this.findingsService.visible(user, id, tx, true);
      if (input.assigneeId && !(await this.scaffolds.isForeman(user.organisationId, input.assigneeId, tx))) {
        throw new AppError(ErrorCode.ValidationFailed, 'The request is not valid', [
          { path: ['assigneeId'], code: 'not_a_foreman', message: 'Not a foreman of this organisation' },
        ]);
      }
      const row = await this.findings.update(id, { assigneeId: input.assigneeId, dueAt: input.dueAt ? new Date(input.dueAt) : null }, tx);
      const finding = toFinding(row);
      await this.audit.record(tx, user, { entityType: 'finding', entityId: id, action: 'assign', before: toFinding(current), after: finding });
      // A newly assigned High finding tells its foreman, once, in this transaction.
      if (row.assigneeId && row.assigneeId !== current.assigneeId && row.riskBand === 'High') {
        await this.reportMail.enqueueAssignmentMail(tx, id, row.assigneeId);
      }
      return finding;
    });
  }
}
