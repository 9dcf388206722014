import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  ScaffoldCreateSchema,
  ScaffoldListQuerySchema,
  ScaffoldListResponseSchema,
  ScaffoldSchema,
  ScaffoldStatusChangeSchema,
  ScaffoldUpdateSchema,
} from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { ScaffoldsService } from './scaffolds.service.js';

class ScaffoldDto extends createZodDto(ScaffoldSchema) {}
class ScaffoldListDto extends createZodDto(ScaffoldListResponseSchema) {}
class ScaffoldListQueryDto extends createZodDto(ScaffoldListQuerySchema) {}
class ScaffoldCreateDto extends createZodDto(ScaffoldCreateSchema) {}
class ScaffoldUpdateDto extends createZodDto(ScaffoldUpdateSchema) {}
class ScaffoldStatusChangeDto extends createZodDto(ScaffoldStatusChangeSchema) {}

@ApiTags('scaffolds')
@ApiBearerAuth()
@Controller('scaffolds')
export class ScaffoldsController {
  constructor(private readonly scaffolds: ScaffoldsService) {}

  @Get()
  @ApiOkResponse({ type: ScaffoldListDto })
  list(@CurrentUser() user: AuthUser, @Query() query: ScaffoldListQueryDto) {
    return this.scaffolds.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: ScaffoldDto })
  get(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.scaffolds.get(user, id);
  }

  @Post()
  @Roles('manager', 'admin')
  @ApiCreatedResponse({ type: ScaffoldDto })
  create(@CurrentUser() user: AuthUser, @Body() body: ScaffoldCreateDto) {
    return this.scaffolds.create(user, body);
  }

  @Patch(':id')
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: ScaffoldDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: ScaffoldUpdateDto) {
    return this.scaffolds.update(user, id, body);
  }

  /** Archive a scaffold (struck, or no longer on the site): it leaves the phones at their next pull. */
  @Post(':id/archive')
  @Roles('manager', 'admin')
  @HttpCode(200)
  @ApiOkResponse({ type: ScaffoldDto })
  archive(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.scaffolds.archive(user, id);
  }

  /** No role decorator: the one role and scope check is the command's (scaffold-commands.ts), as through push. */
  @Post(':id/status')
  @HttpCode(200)
  @ApiOkResponse({ type: ScaffoldDto })
  changeStatus(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: ScaffoldStatusChangeDto) {
    return this.scaffolds.changeStatus(user, id, body);
  }
}
