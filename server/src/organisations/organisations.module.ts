import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { OrganisationSettingsService } from './organisation-settings.service.js';
import { OrganisationsController } from './organisations.controller.js';
import { OrganisationsRepository } from './organisations.repository.js';

@Module({
  imports: [AuditModule],
  controllers: [OrganisationsController],
  providers: [OrganisationsRepository, OrganisationSettingsService],
  exports: [OrganisationSettingsService],
})
export class OrganisationsModule {}
