import { Controller, Get, Param, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError, ErrorCode } from '../common/app-error.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { ReportDataRepository } from './report-data.repository.js';
import { renderReportPdf } from './report-pdf.js';
import { ReportPhotos } from './report-photos.js';

/** The signed inspection report as a PDF: managers and admins, and the inspector who made it. */
@ApiTags('inspections')
@ApiBearerAuth()
@Controller('inspections')
export class ReportsController {
  constructor(
    private readonly repo: ReportDataRepository,
    private readonly photos: ReportPhotos,
  ) {}

  @Get(':id/report.pdf')
  @Roles('manager', 'admin', 'inspector')
  @ApiProduces('application/pdf')
  async pdf(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Res() res: Response): Promise<void> {
    const data = await this.repo.load(id, user.organisationId);
    if (!data) throw AppError.notFound('Inspection');
    if (user.role === 'inspector' && data.inspection.inspectorId !== user.userId) {
      throw new AppError(ErrorCode.Forbidden, 'Only the inspector who made this report, managers and admins may download it');
    }
    if (!data.inspection.finishedAt) throw new AppError(ErrorCode.Conflict, 'The inspection is not finished yet; there is no report');
    const pdf = await renderReportPdf(data, await this.photos.thumbnails(data.findings));
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="inspection-report-${id}.pdf"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.end(pdf);
  }
}
