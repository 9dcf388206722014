import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { SitesModule } from '../sites/sites.module.js';
import { ScaffoldCommands } from './scaffold-commands.js';
import { ScaffoldsController } from './scaffolds.controller.js';
import { ScaffoldsRepository } from './scaffolds.repository.js';
import { ScaffoldsService } from './scaffolds.service.js';

@Module({
  imports: [AuditModule, SitesModule],
  controllers: [ScaffoldsController],
  providers: [ScaffoldsRepository, ScaffoldCommands, ScaffoldsService],
  exports: [ScaffoldsRepository, ScaffoldCommands],
})
export class ScaffoldsModule {}
