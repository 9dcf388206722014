import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { RegisterModule } from '../register/register.module.js';
import { ScaffoldsModule } from '../scaffolds/scaffolds.module.js';
import { InspectionCommandRepository } from './inspection-command.repository.js';
import { InspectionCommands } from './inspection-commands.js';
import { InspectionsController } from './inspections.controller.js';
import { InspectionsRepository } from './inspections.repository.js';
import { InspectionsService } from './inspections.service.js';

@Module({
  imports: [AuditModule, ScaffoldsModule, RegisterModule],
  controllers: [InspectionsController],
  providers: [InspectionsRepository, InspectionCommandRepository, InspectionCommands, InspectionsService],
  exports: [InspectionsRepository, InspectionCommands],
})
export class InspectionsModule {}
