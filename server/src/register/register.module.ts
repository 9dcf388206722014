import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { SitesModule } from '../sites/sites.module.js';
import { RegisterController } from './register.controller.js';
import { RegisterRepository } from './register.repository.js';
import { RegisterService } from './register.service.js';

@Module({
  imports: [AuditModule, ScaffoldsModule, SitesModule],
  controllers: [RegisterController],
  providers: [RegisterRepository, RegisterService],
  exports: [RegisterRepository],
})
export class RegisterModule {}
