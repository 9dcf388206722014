import { Module } from '@nestjs/common';
import { ReportDataRepository } from './report-data.repository.js';
import { ReportPhotos } from './report-photos.js';
import { ReportsController } from './reports.controller.js';

/** The inspection report: its data, photos and PDF (the e-mail that carries it is in mail/). */
@Module({
  controllers: [ReportsController],
  providers: [ReportDataRepository, ReportPhotos],
  exports: [ReportDataRepository, ReportPhotos],
})
export class ReportsModule {}
