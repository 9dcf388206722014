import { Controller, Get, Param, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { MailListResponse } from '@plummet/shared';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { MailBoxService } from './mail-box.service.js';
import { MailListResponseDto, MailListQueryDto } from './mail.dto.js';

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
  @ApiOkResponse({ type: MailListResponseDto.Output })
  list(@CurrentUser() user: AuthUser, @Query() query: MailListQueryDto): Promise<MailListResponse> {
    return this.mailBox.list(query, user.organisationId);
  }

  @Get(':name')
  @ApiProduces('text/plain')
  async read(@CurrentUser() user: AuthUser, @Param('name') name: string, @Res({ passthrough: true }) res: Response): Promise<string> {
    const raw = await this.mailBox.read(name, user.organisationId);
    // Set only on success: errors keep the JSON body type.
    res.type('text/plain; charset=utf-8');
    return raw;
  }
}
