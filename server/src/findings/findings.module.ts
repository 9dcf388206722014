import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { CatalogueModule } from '../catalogue/catalogue.module.js';
import { InspectionsModule } from '../inspections/inspections.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { FindingCommands } from './finding-commands.js';
import { FindingsExportController } from './findings-export.controller.js';
import { FindingsExportRepository } from './findings-export.repository.js';
import { FindingsExportService } from './findings-export.service.js';
import { FindingsController } from './findings.controller.js';
import { FindingsRepository } from './findings.repository.js';
import { FindingsService } from './findings.service.js';

@Module({
  imports: [AuditModule, ScaffoldsModule, InspectionsModule, CatalogueModule],
  // The export first: its fixed path must win over `:id`.
  controllers: [FindingsExportController, FindingsController],
  providers: [FindingsRepository, FindingsService, FindingCommands, FindingsExportRepository, FindingsExportService],
  exports: [FindingsRepository, FindingCommands],
})
export class FindingsModule {}
