import { Controller, Get, Param, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { MailListResponse, MailMessageView } from '@plummet/shared';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { MailBoxService } from './mail-box.service.js';
import { MailListResponseDto, MailListQueryDto, MailMessageViewDto } from './mail.dto.js';
import { escapeHtml } from './mail.layout.js';
import { viewOf } from './mail-view.js';

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

  /** The message's parts and attachments (parsed with mailparser). */
  @Get(':name/view')
  @ApiOkResponse({ type: MailMessageViewDto })
  async view(@CurrentUser() user: AuthUser, @Param('name') name: string): Promise<MailMessageView> {
    return viewOf(name, await this.mailBox.read(name, user.organisationId));
  }

  /** The HTML part alone, to render in a browser tab: sandboxed, nothing loads but its inline images. */
  @Get(':name/html')
  @ApiProduces('text/html')
  async html(@CurrentUser() user: AuthUser, @Param('name') name: string, @Res({ passthrough: true }) res: Response): Promise<string> {
    const view = await viewOf(name, await this.mailBox.read(name, user.organisationId));
    res.setHeader('Content-Security-Policy', "default-src 'none'; img-src data:; style-src 'unsafe-inline'; sandbox");
    res.type('text/html; charset=utf-8');
    return view.html ?? `<pre>${escapeHtml(view.text)}</pre>`;
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
