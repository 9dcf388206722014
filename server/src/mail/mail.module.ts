import { Global, Module } from '@nestjs/common';
import { ReportsModule } from '../reports/reports.module.js';
import { DigestRepository } from './digest/digest.repository.js';
import { DigestService } from './digest/digest.service.js';
import { AssignmentMailSender } from './assignment-mail.sender.js';
import { MailBoxService } from './mail-box.service.js';
import { MailJobsController } from './mail-jobs.controller.js';
import { MailController } from './mail.controller.js';
import { MailService } from './mail.service.js';
import { FailedMailJobsRepository } from './queue/failed-mail-jobs.repository.js';
import { FailedMailJobsService } from './queue/failed-mail-jobs.service.js';
import { MailJobsService } from './queue/mail-jobs.service.js';
import { ReportMailQueue } from './report-mail.queue.js';
import { ReportMailSender } from './report-mail.sender.js';
import { ReportSendController } from './report-send.controller.js';

/** Outgoing e-mail for every feature (sent now or queued in PostgreSQL), plus the development view of captured mail. */
@Global()
@Module({
  imports: [ReportsModule],
  controllers: [MailController, MailJobsController, ReportSendController],
  providers: [MailService, MailBoxService, MailJobsService, ReportMailQueue, ReportMailSender, AssignmentMailSender, FailedMailJobsRepository, FailedMailJobsService, DigestRepository, DigestService],
  exports: [MailService, ReportMailQueue, MailJobsService],
})
export class MailModule {}
