import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { SitesController } from './sites.controller.js';
import { SitesRepository } from './sites.repository.js';
import { SitesService } from './sites.service.js';

@Module({
  imports: [AuditModule],
  controllers: [SitesController],
  providers: [SitesRepository, SitesService],
  exports: [SitesRepository],
})
export class SitesModule {}
