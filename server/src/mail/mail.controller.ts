import { Controller, Get, Header, Param, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { MailList } from '@plummet/shared';
import { Roles } from '../auth/auth.decorators.js';
import { MailBoxService } from './mail-box.service.js';
import { MailListDto, MailListQueryDto } from './mail.dto.js';

/**
 * Development aid for admins: browse what the local SMTP fake captured in MAIL_DIR (invitations,
 * password resets). Answers 404 when MAIL_DIR is not set.
 */
@ApiTags('mail')
@ApiBearerAuth()
@Roles('admin')
@Controller('mail')
export class MailController {
  constructor(private readonly mailBox: MailBoxService) {}

  @Get()
  @ApiOkResponse({ type: MailListDto.Output })
  list(@Query() query: MailListQueryDto): Promise<MailList> {
    return this.mailBox.list(query);
  }

  @Get(':name')
  @Header('Content-Type', 'text/plain; charset=utf-8')
  read(@Param('name') name: string): Promise<string> {
    return this.mailBox.read(name);
  }
}
