import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { ScaffoldReportsQuerySchema, ScaffoldReportsSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { ScaffoldReportsService } from './scaffold-reports.service.js';

class ScaffoldReportsDto extends createZodDto(ScaffoldReportsSchema) {}
class ScaffoldReportsQueryDto extends createZodDto(ScaffoldReportsQuerySchema) {}

@ApiTags('reports')
@ApiBearerAuth()
@Controller('reports')
export class ScaffoldReportsController {
  constructor(private readonly reports: ScaffoldReportsService) {}

  /** One scaffold's inspections with date, inspector, reason, findings count and tag status given. */
  @Get('scaffold')
  @Roles('manager', 'admin', 'inspector')
  @ApiOkResponse({ type: ScaffoldReportsDto })
  list(@CurrentUser() user: AuthUser, @Query() query: ScaffoldReportsQueryDto) {
    return this.reports.list(user, query);
  }
}
