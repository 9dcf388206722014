import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { CatalogueController } from './catalogue.controller.js';
import { CatalogueRepository } from './catalogue.repository.js';
import { CatalogueService } from './catalogue.service.js';

/** The item catalogue; built-ins are upserted in the migration step (catalogue-builtins.ts). */
@Module({
  imports: [AuditModule],
  controllers: [CatalogueController],
  providers: [CatalogueRepository, CatalogueService],
  exports: [CatalogueRepository],
})
export class CatalogueModule {}
