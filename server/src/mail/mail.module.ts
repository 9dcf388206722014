import { Global, Module } from '@nestjs/common';
import { MailBoxService } from './mail-box.service.js';
import { MailController } from './mail.controller.js';
import { MailService } from './mail.service.js';

/** Outgoing e-mail for every feature, plus the development view of captured mail. */
@Global()
@Module({
  controllers: [MailController],
  providers: [MailService, MailBoxService],
  exports: [MailService],
})
export class MailModule {}
