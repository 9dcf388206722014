import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { CatalogueModule } from '../catalogue/catalogue.module.js';
import { InspectionsModule } from '../inspections/inspections.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { FindingCommands } from './finding-commands.js';
import { FindingsController } from './findings.controller.js';
import { FindingsRepository } from './findings.repository.js';
import { FindingsService } from './findings.service.js';

@Module({
  imports: [AuditModule, ScaffoldsModule, InspectionsModule, CatalogueModule],
  controllers: [FindingsController],
  providers: [FindingsRepository, FindingsService, FindingCommands],
  exports: [FindingsRepository, FindingCommands],
})
export class FindingsModule {}
