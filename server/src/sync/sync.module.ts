import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { EndedSessionPushes } from './ended-session-pushes.js';
import { CatalogueModule } from '../catalogue/catalogue.module.js';
import { FindingsModule } from '../findings/findings.module.js';
import { InspectionsModule } from '../inspections/inspections.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { UsersModule } from '../users/users.module.js';
import { RecordSyncService } from './record-sync.service.js';
import { FindingSyncService } from './finding-sync.service.js';
import { SyncConflictsService } from './sync-conflicts.service.js';
import { SyncBatchRepository } from './sync-batch.repository.js';
import { SyncPullRepository } from './sync-pull.repository.js';
import { SyncPullService } from './sync-pull.service.js';
import { SyncPushService } from './sync-push.service.js';
import { SyncController } from './sync.controller.js';
import { SyncRepository } from './sync.repository.js';

/** Offline sync: push of phone mutations, the change feed, conflicts. */
@Module({
  imports: [AuditModule, FindingsModule, ScaffoldsModule, InspectionsModule, CatalogueModule, UsersModule],
  controllers: [SyncController],
  providers: [EndedSessionPushes, SyncRepository, SyncBatchRepository, SyncPullRepository, FindingSyncService, RecordSyncService, SyncPushService, SyncPullService, SyncConflictsService],
})
export class SyncModule {}
