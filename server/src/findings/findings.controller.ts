import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  FindingAssignSchema,
  FindingCreateSchema,
  FindingListQuerySchema,
  FindingListResponseSchema,
  FindingSchema,
  FindingStateChangeSchema,
  FindingUpdateSchema,
} from '@plummet/shared';
import type { Response } from 'express';
import { createZodDto } from 'nestjs-zod';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { FindingWorkflowService } from './finding-workflow.service.js';
import { FindingsService } from './findings.service.js';

class FindingDto extends createZodDto(FindingSchema) {}
class FindingListDto extends createZodDto(FindingListResponseSchema) {}
class FindingListQueryDto extends createZodDto(FindingListQuerySchema) {}
class FindingCreateDto extends createZodDto(FindingCreateSchema) {}
class FindingUpdateDto extends createZodDto(FindingUpdateSchema) {}
class FindingStateChangeDto extends createZodDto(FindingStateChangeSchema) {}
class FindingAssignDto extends createZodDto(FindingAssignSchema) {}

@ApiTags('findings')
@ApiBearerAuth()
@Controller('findings')
export class FindingsController {
  constructor(
    private readonly findings: FindingsService,
    private readonly workflow: FindingWorkflowService,
  ) {}

  /**
   * Highest risk first by default. A foreman sees only findings on their scaffolds or assigned to them.
   * Items carry the estimate summary unless `estimate=full`.
   */
  @Get()
  @ApiOkResponse({ type: FindingListDto })
  list(@CurrentUser() user: AuthUser, @Query() query: FindingListQueryDto) {
    return this.findings.list(user, query);
  }

  @Get(':id')
  @ApiOkResponse({ type: FindingDto })
  get(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.findings.get(user, id);
  }

  /** The estimate is computed here with the shared physics; estimate fields in the body are ignored. 200 for a retry. */
  @Post()
  @Roles('inspector')
  @ApiCreatedResponse({ type: FindingDto })
  @ApiOkResponse({ type: FindingDto, description: 'A retry: the finding already existed with this body' })
  async create(@CurrentUser() user: AuthUser, @Body() body: FindingCreateDto, @Res({ passthrough: true }) res: Response) {
    const { finding, created } = await this.findings.create(user, body);
    res.status(created ? 201 : 200);
    return finding;
  }

  @Patch(':id')
  @Roles('inspector')
  @ApiOkResponse({ type: FindingDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingUpdateDto) {
    return this.findings.update(user, id, body);
  }

  /** Checked against the transition table in shared/src/findings/finding-state.ts. */
  @Post(':id/state')
  @Roles('inspector', 'manager', 'foreman')
  @HttpCode(200)
  @ApiOkResponse({ type: FindingDto })
  changeState(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingStateChangeDto) {
    return this.workflow.changeState(user, id, body);
  }

  @Post(':id/assign')
  @Roles('manager', 'admin', 'inspector')
  @HttpCode(200)
  @ApiOkResponse({ type: FindingDto })
  assign(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingAssignDto) {
    return this.workflow.assign(user, id, body);
  }
}
