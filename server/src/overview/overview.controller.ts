import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { OverviewQuerySchema, OverviewSchema, PeopleSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { OverviewRepository } from './overview.repository.js';
import { OverviewService } from './overview.service.js';

class OverviewDto extends createZodDto(OverviewSchema) {}
class PeopleDto extends createZodDto(PeopleSchema) {}
class OverviewQueryDto extends createZodDto(OverviewQuerySchema) {}

@ApiTags('overview')
@ApiBearerAuth()
@Controller('overview')
export class OverviewController {
  constructor(
    private readonly overview: OverviewService,
    private readonly repository: OverviewRepository,
  ) {}

  /** Open risk, overdue work, due inspections and conflicts, for the organisation or one site. */
  @Get()
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: OverviewDto })
  get(@CurrentUser() user: AuthUser, @Query() query: OverviewQueryDto) {
    return this.overview.get(user, query);
  }

  /** Names and roles of the organisation's active members: whom a manager can assign to, and who did what. */
  @Get('people')
  @Roles('manager', 'admin', 'inspector')
  @ApiOkResponse({ type: PeopleDto })
  async people(@CurrentUser() user: AuthUser) {
    return { items: await this.repository.people(user.organisationId) };
  }
}
