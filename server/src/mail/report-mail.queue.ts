import { createHash, randomUUID } from 'node:crypto';
import { Inject, Injectable } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import type { DbExecutor } from '../db/db.tokens.js';
import { requireOrganisation } from '../db/organisation-context.js';
import { MAIL_QUEUES, retryOptions } from './queue/job-schema.js';
import { MailJobsService } from './queue/mail-jobs.service.js';
import { transactionDb } from './queue/transaction-db.js';

/** A stable job id per purpose and record: the same finish committed twice cannot queue two jobs. */
export function jobIdFor(purpose: string, ...keys: string[]): string {
  const hex = createHash('sha256').update([purpose, ...keys].join(':')).digest('hex');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-5${hex.slice(13, 16)}-a${hex.slice(17, 20)}-${hex.slice(20, 32)}`;
}

/** Jobs carry their organisation: the worker runs them inside it (row-level security). */
export interface ReportJobData {
  organisationId: string;
  inspectionId: string;
  /** Set on a manager's re-send: then only the managers get it again, not the client. */
  resentBy?: string;
}
export interface AssignmentJobData {
  organisationId: string;
  findingId: string;
  assigneeId: string;
}

/**
 * The one door to the mail queue for the features that cause e-mail. Each enqueue takes the
 * caller's open transaction: the job is a row in that transaction, so a crash loses neither the
 * record nor its e-mail, and a rolled-back write sends nothing.
 */
@Injectable()
export class ReportMailQueue {
  constructor(
    private readonly jobs: MailJobsService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** Queues the findings list and signed report of a finished inspection, once per inspection. */
  async enqueueInspectionReport(tx: DbExecutor, inspectionId: string): Promise<void> {
    const data: ReportJobData = { organisationId: requireOrganisation(), inspectionId };
    await this.jobs.queue.send(MAIL_QUEUES.report, data, {
      id: jobIdFor('report', inspectionId),
      singletonKey: inspectionId,
      ...retryOptions(this.config),
      db: transactionDb(tx),
    });
  }

  /** A manager's explicit re-send: a new job each time (the first one is never replaced). */
  async enqueueReportResend(inspectionId: string, managerId: string): Promise<string> {
    const id = randomUUID();
    const data: ReportJobData = { organisationId: requireOrganisation(), inspectionId, resentBy: managerId };
    await this.jobs.queue.send(MAIL_QUEUES.report, data, { id, ...retryOptions(this.config) });
    return id;
  }

  /** Queues the foreman's e-mail for a newly assigned finding, once per finding and assignee. */
  async enqueueAssignmentMail(tx: DbExecutor, findingId: string, assigneeId: string): Promise<void> {
    const data: AssignmentJobData = { organisationId: requireOrganisation(), findingId, assigneeId };
    await this.jobs.queue.send(MAIL_QUEUES.assignment, data, {
      id: jobIdFor('assignment', findingId, assigneeId),
      singletonKey: `${findingId}:${assigneeId}`,
      ...retryOptions(this.config),
      db: transactionDb(tx),
    });
  }
}
