import { Module } from '@nestjs/common';
import { OverviewRepository } from '../overview/overview.repository.js';
import { TrendsController } from './trends.controller.js';
import { TrendsRepository } from './trends.repository.js';
import { TrendsService } from './trends.service.js';

@Module({ controllers: [TrendsController], providers: [TrendsRepository, TrendsService, OverviewRepository] })
export class TrendsModule {}
