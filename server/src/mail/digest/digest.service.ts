import { Inject, Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { readOrganisationSettings } from '@plummet/shared';
import { APP_CONFIG, type AppConfig } from '../../config/config.js';
import { DRIZZLE, type Db } from '../../db/db.tokens.js';
import { runInOrganisation } from '../../db/organisation-context.js';
import { appOrigin } from '../app-links.js';
import { MailService } from '../mail.service.js';
import { MAIL_QUEUES, retryOptions } from '../queue/job-schema.js';
import { MailJobsService } from '../queue/mail-jobs.service.js';
import { transactionDb } from '../queue/transaction-db.js';
import { jobIdFor } from '../report-mail.queue.js';
import { digestSites, localClock } from './digest-content.js';
import { renderDigestMail } from './digest.layout.js';
import { DigestRepository } from './digest.repository.js';

export interface DigestJobData {
  organisationId: string;
  userId: string;
  localDate: string;
  /** The tick's instant (ISO): the digest describes this moment, however late the job runs. */
  at: string;
}

/**
 * The daily digest. A pg-boss schedule runs the tick; the tick claims each organisation's local day
 * (digest_runs) once its digest hour has come and, in the same transaction, queues one job per
 * manager and foreman. Each job reads that person's scope and sends nothing when it is empty.
 */
@Injectable()
export class DigestService implements OnApplicationBootstrap {
  private readonly logger = new Logger(DigestService.name);

  constructor(
    private readonly repo: DigestRepository,
    private readonly mail: MailService,
    private readonly jobs: MailJobsService,
    @Inject(DRIZZLE) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {
    jobs.handle(MAIL_QUEUES.digestTick, () => this.queueDue(new Date()).then(() => undefined));
    jobs.handle(MAIL_QUEUES.digest, (data) => this.send(data as unknown as DigestJobData));
  }

  async onApplicationBootstrap(): Promise<void> {
    // pg-boss keeps one schedule per name in PostgreSQL and runs each slot once across replicas.
    if (this.config.MAIL_WORKERS && this.config.DIGEST_CRON) await this.jobs.queue.schedule(MAIL_QUEUES.digestTick, this.config.DIGEST_CRON, {}, { tz: 'UTC' });
  }

  /** Queues the digests of every organisation whose local digest hour has come today; returns the organisations queued. */
  async queueDue(now: Date): Promise<string[]> {
    const queued: string[] = [];
    // The tick belongs to no organisation: it visits each in its own scope.
    for (const organisationId of await this.repo.organisationIds()) {
      if (await runInOrganisation(organisationId, () => this.queueDueIn(organisationId, now))) queued.push(organisationId);
    }
    return queued;
  }

  /** Queues the organisation's digests if its local digest hour has come and no run claimed the day. */
  private async queueDueIn(organisationId: string, now: Date): Promise<boolean> {
    const org = (await this.repo.organisations()).find((o) => o.id === organisationId);
    if (!org) return false;
    const settings = readOrganisationSettings(org.settings);
    const clock = localClock(now, settings.timeZone);
    if (clock.hour < settings.digestHour) return false;
    return this.db.transaction(async (tx) => {
      if (!(await this.repo.claim(org.id, clock.date, tx))) return false;
      for (const person of await this.repo.recipients(org.id, tx)) {
        const data: DigestJobData = { organisationId: org.id, userId: person.id, localDate: clock.date, at: now.toISOString() };
        await this.jobs.queue.send(MAIL_QUEUES.digest, data, {
          id: jobIdFor('digest', org.id, clock.date, person.id),
          ...retryOptions(this.config),
          db: transactionDb(tx),
        });
      }
      return true;
    });
  }

  /** Builds one person's digest; undefined when there is nothing to say. */
  async build(job: DigestJobData) {
    const org = (await this.repo.organisations()).find((o) => o.id === job.organisationId);
    const person = await this.repo.recipient(job.organisationId, job.userId);
    if (!org || !person) return undefined;
    const settings = readOrganisationSettings(org.settings);
    const at = new Date(job.at);
    const scope = person.role === 'foreman' ? person.id : undefined;
    const [open, overdue, due] = await Promise.all([
      this.repo.openCounts(org.id, at, scope),
      this.repo.overdueFixes(org.id, at, scope),
      this.repo.dueScaffolds(org.id, at, scope),
    ]);
    const sites = digestSites(open, overdue, due);
    if (sites.length === 0) return undefined;
    const rendered = renderDigestMail({
      recipientName: person.name,
      role: person.role,
      organisationName: org.name,
      localDate: job.localDate,
      timeZone: settings.timeZone,
      sites,
      appUrl: appOrigin(this.config),
    });
    return { to: person.email, sites, ...rendered };
  }

  private async send(job: DigestJobData): Promise<void> {
    const digest = await this.build(job);
    if (!digest) {
      this.logger.log(`digest ${job.localDate} for user ${job.userId}: nothing to say, not sent`);
      return;
    }
    await this.mail.sendMessage({ organisationId: job.organisationId, to: [digest.to], subject: digest.subject, text: digest.text, html: digest.html });
  }
}
