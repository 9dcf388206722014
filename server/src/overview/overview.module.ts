import { Module } from '@nestjs/common';
import { OverviewController } from './overview.controller.js';
import { OverviewRepository } from './overview.repository.js';
import { OverviewService } from './overview.service.js';

@Module({ controllers: [OverviewController], providers: [OverviewRepository, OverviewService] })
export class OverviewModule {}
