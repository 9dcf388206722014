import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { TrendsQuerySchema, TrendsSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { TrendsService } from './trends.service.js';

class TrendsDto extends createZodDto(TrendsSchema) {}
class TrendsQueryDto extends createZodDto(TrendsQuerySchema) {}

@ApiTags('trends')
@ApiBearerAuth()
@Controller('trends')
export class TrendsController {
  constructor(private readonly trends: TrendsService) {}

  /** Raised and closed per week by band, median time to fix by band, repeat locations. */
  @Get()
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: TrendsDto })
  get(@CurrentUser() user: AuthUser, @Query() query: TrendsQueryDto) {
    return this.trends.get(user, query);
  }
}
