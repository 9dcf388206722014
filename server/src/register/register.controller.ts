import { Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { RegisterDueListSchema, RegisterDueQuerySchema, ScaffoldTriggerCreateSchema, ScaffoldTriggerResultSchema } from '@plummet/shared';
import { createZodDto } from 'nestjs-zod';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { RegisterService } from './register.service.js';

class ScaffoldTriggerCreateDto extends createZodDto(ScaffoldTriggerCreateSchema) {}
class ScaffoldTriggerResultDto extends createZodDto(ScaffoldTriggerResultSchema) {}
class RegisterDueListDto extends createZodDto(RegisterDueListSchema) {}
class RegisterDueQueryDto extends createZodDto(RegisterDueQuerySchema) {}

@ApiTags('register')
@ApiBearerAuth()
@Controller()
export class RegisterController {
  constructor(private readonly register: RegisterService) {}

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
}
