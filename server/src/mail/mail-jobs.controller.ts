import { Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { MailJobListResponseSchema, type MailJobListResponse } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { FailedMailJobsService } from './queue/failed-mail-jobs.service.js';

class MailJobListDto extends createZodDto(MailJobListResponseSchema) {}

/** Admins see the e-mails of their organisation that failed after every retry, and send them again. */
@ApiTags('mail')
@ApiBearerAuth()
@Roles('admin')
@Controller('mail-jobs')
export class MailJobsController {
  constructor(private readonly failed: FailedMailJobsService) {}

  @Get('failed')
  @ApiOkResponse({ type: MailJobListDto })
  async list(@CurrentUser() user: AuthUser): Promise<MailJobListResponse> {
    return { items: await this.failed.list(user.organisationId) };
  }

  /** Puts a failed job back in the queue (pg-boss `retry`); 404 for another organisation's or a job that is not failed. */
  @Post(':id/retry')
  @HttpCode(202)
  async retry(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string): Promise<{ id: string; state: 'retry' }> {
    if (!(await this.failed.retry(user.organisationId, id))) throw AppError.notFound('Failed mail job');
    return { id, state: 'retry' };
  }
}
