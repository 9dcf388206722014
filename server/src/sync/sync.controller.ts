import { Body, Controller, Get, HttpCode, Param, Post, Query, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  SyncConflictListQuerySchema,
  SyncConflictListResponseSchema,
  SyncConflictResolveSchema,
  SyncConflictSchema,
  SyncPullQuerySchema,
  SyncPullResponseSchema,
  SyncPushResponseSchema,
  SyncPushSchema,
} from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { AcceptsEndedSession, CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { IdParamPipe } from '../common/id-param.pipe.js';
import { EndedSessionPushes } from './ended-session-pushes.js';
import { jsonAnswer, rawJsonPieces } from './raw-json.js';
import { SyncConflictsService } from './sync-conflicts.service.js';
import { SyncPullService } from './sync-pull.service.js';
import { SyncPushService } from './sync-push.service.js';

class SyncPushDto extends createZodDto(SyncPushSchema) {}
class SyncPushResponseDto extends createZodDto(SyncPushResponseSchema) {}
class SyncPullQueryDto extends createZodDto(SyncPullQuerySchema) {}
class SyncPullResponseDto extends createZodDto(SyncPullResponseSchema) {}
class SyncConflictDto extends createZodDto(SyncConflictSchema) {}
class SyncConflictListQueryDto extends createZodDto(SyncConflictListQuerySchema) {}
class SyncConflictListDto extends createZodDto(SyncConflictListResponseSchema) {}
class SyncConflictResolveDto extends createZodDto(SyncConflictResolveSchema) {}

@ApiTags('sync')
@ApiBearerAuth()
@Controller('sync')
export class SyncController {
  constructor(
    private readonly pushes: SyncPushService,
    private readonly pulls: SyncPullService,
    private readonly conflicts: SyncConflictsService,
    private readonly endedSessions: EndedSessionPushes,
  ) {}

  /**
   * Every role: what a mutation may do is checked per mutation (rejected with a reason). Also
   * takes work of a member deactivated while offline, flagged for a manager (EndedSessionPushes).
   */
  @Post('push')
  @HttpCode(200)
  @AcceptsEndedSession()
  @ApiOkResponse({ type: SyncPushResponseDto })
  async push(@CurrentUser() user: AuthUser, @Body() body: SyncPushDto): Promise<StreamableFile> {
    const result = await this.pushes.push(user, body);
    if (user.sessionEnded) await this.endedSessions.flag(user, body);
    return jsonAnswer(JSON.stringify(result));
  }

  /** The findings' estimates go out as PostgreSQL wrote them, never parsed here (raw-json.ts). */
  @Get('pull')
  @ApiOkResponse({ type: SyncPullResponseDto })
  async pull(@CurrentUser() user: AuthUser, @Query() query: SyncPullQueryDto): Promise<StreamableFile> {
    return jsonAnswer(rawJsonPieces(await this.pulls.changes(user, query)));
  }

  @Get('conflicts')
  @Roles('inspector', 'manager', 'admin')
  @ApiOkResponse({ type: SyncConflictListDto })
  listConflicts(@CurrentUser() user: AuthUser, @Query() query: SyncConflictListQueryDto) {
    return this.conflicts.list(user, query);
  }

  @Post('conflicts/:id/resolve')
  @Roles('inspector', 'manager', 'admin')
  @HttpCode(200)
  @ApiOkResponse({ type: SyncConflictDto })
  resolve(@CurrentUser() user: AuthUser, @Param('id', IdParamPipe) id: string, @Body() body: SyncConflictResolveDto) {
    return this.conflicts.resolve(user, id, body);
  }
}
