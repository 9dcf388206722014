import { Inject, Injectable, Logger, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import PgBoss from 'pg-boss';
import { APP_CONFIG, type AppConfig } from '../../config/config.js';
import { isOrganisationId, runInOrganisation } from '../../db/organisation-context.js';
import { type JobQueueName, MAIL_QUEUES } from './job-schema.js';

export type MailJobHandler = (data: Record<string, unknown>) => Promise<void>;

/**
 * The pg-boss instance of this process: jobs live in PostgreSQL, so every replica shares one queue
 * and pg-boss's row locks (SKIP LOCKED) give each job to a single worker. The schema is created
 * by the migrations (job-schema.ts); here pg-boss only runs workers, maintenance and schedules.
 */
@Injectable()
export class MailJobsService implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger(MailJobsService.name);
  private readonly handlers = new Map<JobQueueName, MailJobHandler>();
  private readonly schedules = new Map<JobQueueName, string>();
  private boss: PgBoss | null = null;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  /** Registered by the mail features at construction; workers start once the module is ready. */
  handle(queue: JobQueueName, handler: MailJobHandler): void {
    this.handlers.set(queue, handler);
  }

  /** A recurring job (cron, UTC), stored by pg-boss in PostgreSQL once for all replicas. */
  scheduleDaily(queue: JobQueueName, cron: string): void {
    this.schedules.set(queue, cron);
  }

  async onModuleInit(): Promise<void> {
    const boss = new PgBoss({ connectionString: this.config.DATABASE_URL, max: 3, application_name: 'plummet-jobs' });
    boss.on('error', (error) => this.logger.warn(`job queue: ${error.message}`));
    await boss.start();
    this.boss = boss;
    // Upserts: every replica may set the same schedule, pg-boss keeps one row per queue.
    for (const [queue, cron] of this.schedules) await boss.schedule(queue, cron, {}, { tz: 'UTC' });
    if (!this.config.MAIL_WORKERS) return;
    for (const [queue, handler] of this.handlers) {
      await boss.work<Record<string, unknown>>(queue, { pollingIntervalSeconds: this.config.MAIL_POLL_S, batchSize: 1 }, async ([job]) => {
        try {
          // A job of an organisation runs inside it (row-level security); one of none (the tick,
          // the purge) sees no organisation's rows and crosses them only through its own functions.
          const data = job.data ?? {};
          const organisationId = data.organisationId;
          await (isOrganisationId(organisationId) ? runInOrganisation(organisationId, () => handler(data)) : handler(data));
        } catch (error) {
          this.logger.warn(`${queue} job ${job.id} failed (pg-boss retries it): ${error instanceof Error ? error.message : String(error)}`);
          throw error;
        }
      });
    }
  }

  /** The running instance (sends outside a transaction, retries, schedules). */
  get queue(): PgBoss {
    if (!this.boss) throw new Error('The job queue is not started');
    return this.boss;
  }

  async onApplicationShutdown(): Promise<void> {
    // Graceful: a job being sent finishes (or goes back to the queue when the wait times out).
    await this.boss?.stop({ graceful: true, wait: true, timeout: 10_000 });
    this.boss = null;
  }
}

export { MAIL_QUEUES };
