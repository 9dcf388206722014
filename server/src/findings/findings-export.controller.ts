import { Controller, Get, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import { FindingExportQuerySchema } from '@plummet/shared';
import type { Response } from 'express';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { FindingsExportService } from './findings-export.service.js';

class FindingExportQueryDto extends createZodDto(FindingExportQuerySchema) {}

/** Registered before FindingsController so `export.csv` is not read as a finding id. */
@ApiTags('findings')
@ApiBearerAuth()
@Controller('findings')
export class FindingsExportController {
  constructor(private readonly exports: FindingsExportService) {}

  /** Every finding matching the list's filters, as CSV in the caller's units, streamed in batches. */
  @Get('export.csv')
  @Roles('manager', 'admin', 'inspector')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'CSV with a header row; formula-like cells neutralised' })
  async export(@CurrentUser() user: AuthUser, @Query() query: FindingExportQueryDto, @Res() res: Response): Promise<void> {
    const chunks = this.exports.csv(user, query);
    // The first chunk (lookups and header) before any header is sent: a failure there still gets the error filter.
    const first = await chunks.next();
    const day = new Date().toISOString().slice(0, 10);
    res.status(200);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="findings-${day}.csv"`);
    res.setHeader('Cache-Control', 'no-store');
    // One 'drain' listener for the whole download: the compression middleware hands 'drain'
    // listeners to its zlib stream and never removes them, so a listener per wait would pile up.
    let wake: (() => void) | undefined;
    const resume = () => {
      const waiting = wake;
      wake = undefined;
      waiting?.();
    };
    res.on('drain', resume);
    res.once('close', resume);
    try {
      if (!first.done) res.write(first.value);
      for await (const chunk of chunks) {
        if (res.destroyed) return;
        if (!res.write(chunk)) await new Promise<void>((done) => (wake = done));
      }
      res.end();
    } catch (error) {
      // Headers are gone: cut the response so the client sees an incomplete download, not a short file.
      res.destroy(error as Error);
    }
  }
}
