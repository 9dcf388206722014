import { Inject, Injectable, Logger } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import type { ReportData } from '../reports/report-data.js';
import { ReportDataRepository } from '../reports/report-data.repository.js';
import { renderReportPdf } from '../reports/report-pdf.js';
import { ReportPhotos } from '../reports/report-photos.js';
import { inspectionLink } from './app-links.js';
import { MAIL_QUEUES } from './queue/job-schema.js';
import { MailJobsService } from './queue/mail-jobs.service.js';
import { renderReportMail } from './report-mail.layout.js';
import type { ReportJobData } from './report-mail.queue.js';
import { MailService, type OutgoingMessage } from './mail.service.js';

const unique = (list: (string | null | undefined)[]) => [...new Map(list.filter((a): a is string => !!a).map((a) => [a.toLowerCase(), a])).values()];

/** Who receives a report: managers and assigned foremen in To, the client's copy in Cc. */
export async function reportRecipients(data: ReportData, repo: ReportDataRepository, resent: boolean): Promise<{ to: string[]; cc: string[] }> {
  const managers = await repo.managersFor(data.organisation.id, data.site.id);
  if (resent) return { to: unique(managers.map((m) => m.email)), cc: [] };
  const foremen = data.findings.map((f) => f.assignee?.email);
  const to = unique([...managers.map((m) => m.email), ...foremen]);
  const client = data.organisation.settings.clientCopyOfReports ? unique([data.site.clientContactEmail, ...data.site.reportRecipients]) : [];
  const inTo = new Set(to.map((a) => a.toLowerCase()));
  return { to, cc: client.filter((a) => !inTo.has(a.toLowerCase())) };
}

/** Builds the e-mail with its PDF for a report job; the message is what the queue's worker sends. */
@Injectable()
export class ReportMailSender {
  private readonly logger = new Logger(ReportMailSender.name);

  constructor(
    private readonly repo: ReportDataRepository,
    private readonly photos: ReportPhotos,
    private readonly mail: MailService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    jobs: MailJobsService,
  ) {
    jobs.handle(MAIL_QUEUES.report, (data) => this.send(data as unknown as ReportJobData));
  }

  async build(data: ReportData, resent = false): Promise<{ message: OutgoingMessage; pdf: Buffer }> {
    const thumbnails = await this.photos.thumbnails(data.findings);
    const [pdf, recipients] = await Promise.all([renderReportPdf(data, thumbnails), reportRecipients(data, this.repo, resent)]);
    const mail = renderReportMail(data, thumbnails, inspectionLink(this.config, data.inspection.id));
    const message: OutgoingMessage = {
      organisationId: data.organisation.id,
      ...recipients,
      subject: resent ? `Re-sent: ${mail.subject}` : mail.subject,
      text: mail.text,
      html: mail.html,
      attachments: [
        { filename: `inspection-report-${data.scaffold.reference.replace(/[^A-Za-z0-9-]+/g, '_')}.pdf`, content: pdf, contentType: 'application/pdf', contentDisposition: 'attachment' },
        ...mail.images.map((i) => ({ filename: `finding-${i.findingId}.jpg`, content: i.jpeg, contentType: 'image/jpeg', cid: i.cid, contentDisposition: 'inline' as const })),
      ],
    };
    return { message, pdf };
  }

  private async send(job: ReportJobData): Promise<void> {
    const data = await this.repo.load(job.inspectionId);
    // Deleted or never finished: nothing to report (the job completes rather than retrying forever).
    if (!data || !data.inspection.finishedAt) return;
    const { message } = await this.build(data, job.resentBy !== undefined);
    if (message.to.length + (message.cc?.length ?? 0) === 0) {
      this.logger.warn(`inspection ${job.inspectionId}: nobody to send the report to (no managers)`);
      return;
    }
    await this.mail.sendMessage(message);
  }
}
