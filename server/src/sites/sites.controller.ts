import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { SiteCreateSchema, SiteListQuerySchema, SiteListResponseSchema, SiteSchema, SiteUpdateSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { SitesService } from './sites.service.js';

class SiteDto extends createZodDto(SiteSchema) {}
class SiteListDto extends createZodDto(SiteListResponseSchema) {}
class SiteListQueryDto extends createZodDto(SiteListQuerySchema) {}
class SiteCreateDto extends createZodDto(SiteCreateSchema) {}
class SiteUpdateDto extends createZodDto(SiteUpdateSchema) {}

@ApiTags('sites')
@ApiBearerAuth()
@Controller('sites')
export class SitesController {
  constructor(private readonly sites: SitesService) {}

  @Get()
  @ApiOkResponse({ type: SiteListDto })
  list(@CurrentUser() user: AuthUser, @Query() query: SiteListQueryDto) {
    return this.sites.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: SiteDto })
  get(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.sites.get(user, id);
  }

  @Post()
  @Roles('manager', 'admin')
  @ApiCreatedResponse({ type: SiteDto })
  create(@CurrentUser() user: AuthUser, @Body() body: SiteCreateDto) {
    return this.sites.create(user, body);
  }

  @Patch(':id')
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: SiteDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: SiteUpdateDto) {
    return this.sites.update(user, id, body);
  }

  /** Only a site without scaffolds (409 otherwise). */
  @Delete(':id')
  @Roles('admin')
  @HttpCode(204)
  @ApiNoContentResponse()
  async delete(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string): Promise<void> {
    await this.sites.delete(user, id);
  }
}
