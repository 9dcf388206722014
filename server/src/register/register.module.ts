import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { CatalogueModule } from '../catalogue/catalogue.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { SitesModule } from '../sites/sites.module.js';
import { ExclusionZonesRepository } from './exclusion-zones.repository.js';
import { ExclusionZonesService } from './exclusion-zones.service.js';
import { RegisterController } from './register.controller.js';
import { RegisterRepository } from './register.repository.js';
import { RegisterService } from './register.service.js';

@Module({
  imports: [AuditModule, CatalogueModule, ScaffoldsModule, SitesModule],
  controllers: [RegisterController],
  providers: [RegisterRepository, RegisterService, ExclusionZonesRepository, ExclusionZonesService],
  exports: [RegisterRepository],
})
export class RegisterModule {}
