import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { AuditListQuerySchema, AuditListResponseSchema } from '@plummet/shared';
import { createZodDto } from '../common/zod-dto.js';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { AuditService } from './audit.service.js';

class AuditListQueryDto extends createZodDto(AuditListQuerySchema) {}
class AuditListResponseDto extends createZodDto(AuditListResponseSchema) {}

@ApiTags('audit')
@ApiBearerAuth()
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  /** Who changed what and when, newest first; filter by entity type and id or by actor. */
  @Get()
  @Roles('manager', 'admin')
  @ApiOkResponse({ type: AuditListResponseDto })
  list(@CurrentUser() user: AuthUser, @Query() query: AuditListQueryDto) {
    return this.audit.list(user, query);
  }
}
