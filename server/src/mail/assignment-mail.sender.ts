import { Inject, Injectable } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { ReportDataRepository } from '../reports/report-data.repository.js';
import { dateTime, length } from '../reports/report-format.js';
import { readOrganisationSettings } from '@plummet/shared';
import { findingLink } from './app-links.js';
import { headerText } from './header-text.js';
import { renderMail } from './mail.layout.js';
import { MailService } from './mail.service.js';
import { MAIL_QUEUES } from './queue/job-schema.js';
import { MailJobsService } from './queue/mail-jobs.service.js';
import type { AssignmentJobData } from './report-mail.queue.js';

/** The subject of a foreman's assignment e-mail (also shown for a failed one). */
export function assignmentSubject(itemName: string, siteName: string, scaffoldReference: string): string {
  return `High finding assigned to you: ${headerText(itemName, 60)} · ${headerText(siteName, 60)} · scaffold ${headerText(scaffoldReference, 30)}`;
}

/** The foreman's e-mail for a newly assigned High finding, with a deep link to it. */
@Injectable()
export class AssignmentMailSender {
  constructor(
    private readonly repo: ReportDataRepository,
    private readonly mail: MailService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    jobs: MailJobsService,
  ) {
    jobs.handle(MAIL_QUEUES.assignment, (data) => this.send(data as unknown as AssignmentJobData));
  }

  private async send(job: AssignmentJobData): Promise<void> {
    const found = await this.repo.finding(job.findingId);
    const foreman = await this.repo.user(job.assigneeId);
    // Reassigned again before the job ran: the later assignment sends its own e-mail.
    if (!found || !foreman || found.finding.assigneeId !== job.assigneeId) return;
    const { finding, scaffold, site, organisation } = found;
    const settings = readOrganisationSettings(organisation.settings);
    const units = settings.defaultUnits;
    const where = `${finding.elevation} elevation, lift ${finding.lift}, bay ${finding.bay}, ${length(finding.heightM, units)} up`;
    const content = {
      subject: assignmentSubject(finding.itemName, site.name, scaffold.reference),
      paragraphs: [
        `${foreman.name}, a High finding was assigned to you.`,
        `${finding.itemName} on scaffold ${scaffold.reference} at ${site.name}: ${where}. Risk score ${finding.riskScore}.`,
        finding.dueAt ? `Due: ${dateTime(finding.dueAt, settings.timeZone)}.` : 'No due time is set.',
        ...(finding.notes ? [`Inspector's note: ${finding.notes}`] : []),
      ],
      action: { label: 'Open the finding in Plummet', url: findingLink(this.config, finding.id) },
    };
    const { text, html } = renderMail(content);
    await this.mail.sendMessage({ organisationId: organisation.id, to: [foreman.email], subject: content.subject, text, html });
  }
}
