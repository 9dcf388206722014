import { Controller, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { ReportSendResponse } from '@plummet/shared';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { ReportDataRepository } from '../reports/report-data.repository.js';
import { ReportMailQueue } from './report-mail.queue.js';

/** A manager sends a finished inspection's report again (to the site's managers). */
@ApiTags('inspections')
@ApiBearerAuth()
@Controller('inspections')
export class ReportSendController {
  constructor(
    private readonly repo: ReportDataRepository,
    private readonly queue: ReportMailQueue,
  ) {}

  @Post(':id/report/send')
  @Roles('manager', 'admin')
  @HttpCode(202)
  async resend(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string): Promise<ReportSendResponse> {
    const data = await this.repo.load(id, user.organisationId);
    if (!data) throw AppError.notFound('Inspection');
    if (!data.inspection.finishedAt) throw new AppError(ErrorCode.Conflict, 'The inspection is not finished yet; there is no report to send');
    return { jobId: await this.queue.enqueueReportResend(id, user.userId) };
  }
}
