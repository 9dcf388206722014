import { Injectable } from '@nestjs/common';
import type { MailJob } from '@plummet/shared';
import { ReportDataRepository } from '../../reports/report-data.repository.js';
import { assignmentSubject } from '../assignment-mail.sender.js';
import { DigestRepository } from '../digest/digest.repository.js';
import { headerText } from '../header-text.js';
import { reportSubject } from '../report-mail.layout.js';
import { reportRecipients } from '../report-mail.sender.js';
import { type FailedJobRow, FailedMailJobsRepository } from './failed-mail-jobs.repository.js';
import { MAIL_QUEUES } from './job-schema.js';
import { MailJobsService } from './mail-jobs.service.js';

const text = (value: unknown) => (typeof value === 'string' ? value : '');

/**
 * The organisation's failed mail jobs as an admin reads them: what the e-mail was (its subject as
 * it would be sent now) and to whom, beside pg-boss's own facts (attempts, last error, when).
 */
@Injectable()
export class FailedMailJobsService {
  constructor(
    private readonly failed: FailedMailJobsRepository,
    private readonly reports: ReportDataRepository,
    private readonly digests: DigestRepository,
    private readonly jobs: MailJobsService,
  ) {}

  async list(organisationId: string): Promise<MailJob[]> {
    const rows = await this.failed.list(organisationId);
    return Promise.all(rows.map((row) => this.describe(organisationId, row)));
  }

  /** Puts a failed job back in the queue (pg-boss `retry`); false when the organisation has no such failed job. */
  async retry(organisationId: string, jobId: string): Promise<boolean> {
    const [job] = await this.failed.list(organisationId, jobId);
    if (!job) return false;
    await this.jobs.queue.retry(job.queue, job.id);
    return true;
  }

  private async describe(organisationId: string, row: FailedJobRow): Promise<MailJob> {
    const { queue, data, ...job } = row;
    const about = await this.about(organisationId, queue, data).catch(() => undefined);
    return { ...job, subject: about?.subject ?? null, recipients: about?.recipients ?? [] };
  }

  private async about(organisationId: string, queue: string, data: Record<string, unknown>): Promise<{ subject: string; recipients: string[] } | undefined> {
    if (queue === MAIL_QUEUES.report) {
      const report = await this.reports.load(text(data.inspectionId), organisationId);
      if (!report) return undefined;
      const resent = data.resentBy !== undefined;
      const { to, cc } = await reportRecipients(report, this.reports, resent);
      return { subject: `${resent ? 'Re-sent: ' : ''}${reportSubject(report)}`, recipients: [...to, ...cc] };
    }
    if (queue === MAIL_QUEUES.assignment) {
      const [found, foreman] = await Promise.all([this.reports.finding(text(data.findingId)), this.reports.user(text(data.assigneeId))]);
      if (!found || found.organisation.id !== organisationId) return undefined;
      return { subject: assignmentSubject(found.finding.itemName, found.site.name, found.scaffold.reference), recipients: foreman ? [foreman.email] : [] };
    }
    const person = await this.digests.recipient(organisationId, text(data.userId));
    return { subject: `Daily digest · ${headerText(text(data.localDate), 20)}`, recipients: person ? [person.email] : [] };
  }
}
