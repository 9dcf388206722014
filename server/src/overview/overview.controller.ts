import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { OverviewQuerySchema, OverviewSchema } from '@plummet/shared';
import { createZodDto } from 'nestjs-zod';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { OverviewService } from './overview.service.js';

class OverviewDto extends createZodDto(OverviewSchema) {}
class OverviewQueryDto extends createZodDto(OverviewQuerySchema) {}

@ApiTags('overview')
@ApiBearerAuth()
@Controller('overview')
export class OverviewController {
  constructor(private readonly overview: OverviewService) {}

  /** Open risk, overdue work, due inspections and conflicts, for the organisation or one site. */
  @Get()
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: OverviewDto })
  get(@CurrentUser() user: AuthUser, @Query() query: OverviewQueryDto) {
    return this.overview.get(user, query);
  }
}
