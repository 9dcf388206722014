import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiNoContentResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  CatalogueItemCreateSchema,
  CatalogueItemSchema,
  CatalogueItemUpdateSchema,
  CatalogueListQuerySchema,
  CatalogueListResponseSchema,
} from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { CatalogueService } from './catalogue.service.js';

class CatalogueItemDto extends createZodDto(CatalogueItemSchema) {}
class CatalogueListDto extends createZodDto(CatalogueListResponseSchema) {}
class CatalogueListQueryDto extends createZodDto(CatalogueListQuerySchema) {}
class CatalogueItemCreateDto extends createZodDto(CatalogueItemCreateSchema) {}
class CatalogueItemUpdateDto extends createZodDto(CatalogueItemUpdateSchema) {}

@ApiTags('catalogue')
@ApiBearerAuth()
@Controller('catalogue')
export class CatalogueController {
  constructor(private readonly catalogue: CatalogueService) {}

  /** Built-in items and the organisation's own. */
  @Get()
  @ApiOkResponse({ type: CatalogueListDto })
  list(@CurrentUser() user: AuthUser, @Query() query: CatalogueListQueryDto) {
    return this.catalogue.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: CatalogueItemDto })
  get(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.catalogue.get(user, id);
  }

  @Post()
  @Roles('admin')
  @ApiCreatedResponse({ type: CatalogueItemDto })
  create(@CurrentUser() user: AuthUser, @Body() body: CatalogueItemCreateDto) {
    return this.catalogue.create(user, body);
  }

  @Patch(':id')
  @Roles('admin')
  @ApiOkResponse({ type: CatalogueItemDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: CatalogueItemUpdateDto) {
    return this.catalogue.update(user, id, body);
  }

  @Delete(':id')
  @Roles('admin')
  @HttpCode(204)
  @ApiNoContentResponse()
  async delete(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string): Promise<void> {
    await this.catalogue.delete(user, id);
  }
}
