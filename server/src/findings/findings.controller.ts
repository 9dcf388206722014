import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  FindingAssignSchema,
  FindingCreateSchema,
  FindingHandBackInputSchema,
  FindingHistorySchema,
  FindingListQuerySchema,
  FindingListResponseSchema,
  FindingSchema,
  FindingStateChangeSchema,
  FindingUpdateSchema,
} from '@plummet/shared';
import type { Response } from 'express';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { FindingsService } from './findings.service.js';

class FindingDto extends createZodDto(FindingSchema) {}
class FindingListDto extends createZodDto(FindingListResponseSchema) {}
class FindingListQueryDto extends createZodDto(FindingListQuerySchema) {}
class FindingCreateDto extends createZodDto(FindingCreateSchema) {}
class FindingUpdateDto extends createZodDto(FindingUpdateSchema) {}
class FindingStateChangeDto extends createZodDto(FindingStateChangeSchema) {}
class FindingAssignDto extends createZodDto(FindingAssignSchema) {}
class FindingHandBackDto extends createZodDto(FindingHandBackInputSchema) {}
class FindingHistoryDto extends createZodDto(FindingHistorySchema) {}

@ApiTags('findings')
@ApiBearerAuth()
@Controller('findings')
export class FindingsController {
  constructor(private readonly findings: FindingsService) {}

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

  /** State changes, fixes, verifications, assignments and hand backs with who, when, note, control and photos, oldest first. */
  @Get(':id/history')
  @ApiOkResponse({ type: FindingHistoryDto })
  history(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string) {
    return this.findings.history(user, id);
  }

  // Writes: the role and scope checks are the commands' own (finding-commands.ts), the same as for a push.

  /** The estimate is computed here with the shared physics; estimate fields in the body are ignored. 200 for a retry. */
  @Post()
  @ApiCreatedResponse({ type: FindingDto })
  @ApiOkResponse({ type: FindingDto, description: 'A retry: the finding already existed with this body' })
  async create(@CurrentUser() user: AuthUser, @Body() body: FindingCreateDto, @Res({ passthrough: true }) res: Response) {
    const { finding, created } = await this.findings.create(user, body);
    res.status(created ? 201 : 200);
    return finding;
  }

  @Patch(':id')
  @ApiOkResponse({ type: FindingDto })
  update(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingUpdateDto) {
    return this.findings.update(user, id, body);
  }

  /** Checked against the transition table in shared/src/findings/finding-state.ts. */
  @Post(':id/state')
  @HttpCode(200)
  @ApiOkResponse({ type: FindingDto })
  changeState(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingStateChangeDto) {
    return this.findings.changeState(user, id, body);
  }

  @Post(':id/assign')
  @HttpCode(200)
  @ApiOkResponse({ type: FindingDto })
  assign(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingAssignDto) {
    return this.findings.assign(user, id, body);
  }

  /** A foreman returns a finding they cannot fix, with a reason; a manager reassigns it. */
  @Post(':id/hand-back')
  @HttpCode(200)
  @ApiOkResponse({ type: FindingDto })
  handBack(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: FindingHandBackDto) {
    return this.findings.handBack(user, id, body);
  }
}
