import { Module } from '@nestjs/common';
import { ScaffoldReportsController } from './scaffold-reports.controller.js';
import { ScaffoldReportsRepository } from './scaffold-reports.repository.js';
import { ScaffoldReportsService } from './scaffold-reports.service.js';

@Module({ controllers: [ScaffoldReportsController], providers: [ScaffoldReportsRepository, ScaffoldReportsService] })
export class ScaffoldReportsModule {}
