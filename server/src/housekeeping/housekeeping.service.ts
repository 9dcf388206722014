import { Inject, Injectable, Logger } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { MailJobsService } from '../mail/queue/mail-jobs.service.js';
import { HOUSEKEEPING_CRON, HOUSEKEEPING_QUEUE } from './housekeeping-queue.js';
import { HousekeepingRepository } from './housekeeping.repository.js';

export interface PurgeCounts {
  refreshTokens: number;
  emailTokens: number;
  rateLimits: number;
  syncMutations: number;
}

/**
 * The periodic purge. Safe to run from any replica at any time and more than once (each step is
 * one DELETE by age). Scheduled once a day through the job queue (pg-boss), so one replica runs it.
 */
@Injectable()
export class HousekeepingService {
  private readonly logger = new Logger(HousekeepingService.name);

  constructor(
    private readonly repository: HousekeepingRepository,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    jobs: MailJobsService,
  ) {
    jobs.handle(HOUSEKEEPING_QUEUE, async () => {
      await this.purge();
    });
    jobs.scheduleDaily(HOUSEKEEPING_QUEUE, HOUSEKEEPING_CRON);
  }

  async purge(): Promise<PurgeCounts> {
    // A phone offline longer than SYNC_MUTATION_RETENTION_DAYS may send a mutation again after its
    // record of being applied is gone: that setting is therefore the longest allowed offline period.
    const { refreshTokens, emailTokens, syncMutations } = await this.repository.purgeOrganisationRows(this.config.SYNC_MUTATION_RETENTION_DAYS);
    const counts: PurgeCounts = { refreshTokens, emailTokens, rateLimits: await this.repository.purgeClosedRateLimits(), syncMutations };
    this.logger.log(`purged ${JSON.stringify(counts)}`);
    return counts;
  }
}
