import { Module } from '@nestjs/common';
import { HousekeepingRepository } from './housekeeping.repository.js';
import { HousekeepingService } from './housekeeping.service.js';

/** The purge of expired tokens, closed rate-limit windows and old sync mutations (see HousekeepingService). */
@Module({
  providers: [HousekeepingRepository, HousekeepingService],
  exports: [HousekeepingService],
})
export class HousekeepingModule {}
