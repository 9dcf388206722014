import { Body, Controller, Get, HttpCode, Param, Patch, Post, Put, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  type Control,
  ControlCheckPutSchema,
  ControlCheckSchema,
  ControlSchema,
  InspectionCreateSchema,
  InspectionDetailSchema,
  InspectionFinishSchema,
  InspectionListQuerySchema,
  InspectionListResponseSchema,
  InspectionSchema,
  InspectionUpdateSchema,
} from '@plummet/shared';
import type { Response } from 'express';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AppError } from '../common/app-error.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { InspectionsService } from './inspections.service.js';

class InspectionDto extends createZodDto(InspectionSchema) {}
class InspectionDetailDto extends createZodDto(InspectionDetailSchema) {}
class InspectionListDto extends createZodDto(InspectionListResponseSchema) {}
class InspectionListQueryDto extends createZodDto(InspectionListQuerySchema) {}
class InspectionCreateDto extends createZodDto(InspectionCreateSchema) {}
class InspectionUpdateDto extends createZodDto(InspectionUpdateSchema) {}
class InspectionFinishDto extends createZodDto(InspectionFinishSchema) {}
class ControlCheckDto extends createZodDto(ControlCheckSchema) {}
class ControlCheckPutDto extends createZodDto(ControlCheckPutSchema) {}

/** An unknown control in the path names no record: 404 like an unknown id. */
function parseControl(value: string): Control {
  const parsed = ControlSchema.safeParse(value);
  if (!parsed.success) throw AppError.notFound('Control');
  return parsed.data;
}

/** Writes carry no role decorator: the one role and scope check is the command's (inspection-commands.ts), as through push. */
@ApiTags('inspections')
@ApiBearerAuth()
@Controller('inspections')
export class InspectionsController {
  constructor(private readonly inspections: InspectionsService) {}

  @Get()
  @ApiOkResponse({ type: InspectionListDto })
  list(@CurrentUser() user: AuthUser, @Query() query: InspectionListQueryDto) {
    return this.inspections.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: InspectionDetailDto })
  get(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.inspections.get(user, id);
  }

  /** 201 when new; 200 with the stored record when the same id and body come again. */
  @Post()
  @ApiCreatedResponse({ type: InspectionDto })
  @ApiOkResponse({ type: InspectionDto, description: 'A retry: the inspection already existed with this body' })
  async create(@CurrentUser() user: AuthUser, @Body() body: InspectionCreateDto, @Res({ passthrough: true }) res: Response) {
    const { inspection, created } = await this.inspections.create(user, body);
    res.status(created ? 201 : 200);
    return inspection;
  }

  @Patch(':id')
  @ApiOkResponse({ type: InspectionDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: InspectionUpdateDto) {
    return this.inspections.update(user, id, body);
  }

  @Post(':id/finish')
  @HttpCode(200)
  @ApiOkResponse({ type: InspectionDto })
  finish(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: InspectionFinishDto) {
    return this.inspections.finish(user, id, body);
  }

  @Put(':id/control-checks/:control')
  @ApiOkResponse({ type: ControlCheckDto })
  putControlCheck(
    @CurrentUser() user: AuthUser,
    @Param('id', IdParamPipe) id: string,
    @Param('control') control: string,
    @Body() body: ControlCheckPutDto,
  ) {
    return this.inspections.putControlCheck(user, id, parseControl(control), body);
  }
}
