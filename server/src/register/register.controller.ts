import { Body, Controller, Get, Param, Post, Put, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  ExclusionZoneListSchema,
  ExclusionZonePutSchema,
  ExclusionZoneSchema,
  RegisterDueListSchema,
  RegisterDueQuerySchema,
  ScaffoldTriggerCreateSchema,
  ScaffoldTriggerResultSchema,
} from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { ExclusionZonesService } from './exclusion-zones.service.js';
import { RegisterService } from './register.service.js';

class ScaffoldTriggerCreateDto extends createZodDto(ScaffoldTriggerCreateSchema) {}
class ScaffoldTriggerResultDto extends createZodDto(ScaffoldTriggerResultSchema) {}
class RegisterDueListDto extends createZodDto(RegisterDueListSchema) {}
class RegisterDueQueryDto extends createZodDto(RegisterDueQuerySchema) {}
class ExclusionZoneListDto extends createZodDto(ExclusionZoneListSchema) {}
class ExclusionZoneDto extends createZodDto(ExclusionZoneSchema) {}
class ExclusionZonePutDto extends createZodDto(ExclusionZonePutSchema) {}

@ApiTags('register')
@ApiBearerAuth()
@Controller()
export class RegisterController {
  constructor(
    private readonly register: RegisterService,
    private readonly zones: ExclusionZonesService,
  ) {}

  /** "Altered" or "adverse weather": the scaffold is closed to use and its inspection is due now. */
  @Post('scaffolds/:id/trigger')
  @Roles('inspector', 'foreman', 'manager', 'admin')
  @ApiCreatedResponse({ type: ScaffoldTriggerResultDto })
  trigger(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: ScaffoldTriggerCreateDto) {
    return this.register.trigger(user, id, body);
  }

  /** Inspections due: waiting on a trigger, never inspected, overdue, or due today; with the regime named. */
  @Get('register/due')
  @ApiOkResponse({ type: RegisterDueListDto })
  due(@CurrentUser() user: AuthUser, @Query() query: RegisterDueQueryDto) {
    return this.register.due(user, query);
  }

  /** The exclusion zone below each elevation: the heaviest item, the limiting wind, the width barriered, and the suggestion. */
  @Get('scaffolds/:id/exclusion-zones')
  @ApiOkResponse({ type: ExclusionZoneListDto })
  exclusionZones(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.zones.list(user, id);
  }

  @Put('scaffolds/:id/exclusion-zones/:elevation')
  @Roles('inspector', 'manager', 'admin')
  @ApiOkResponse({ type: ExclusionZoneDto })
  putExclusionZone(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Param('elevation') elevation: string, @Body() body: ExclusionZonePutDto) {
    return this.zones.put(user, id, elevation, body);
  }
}
