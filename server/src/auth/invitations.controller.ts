import { Body, Controller, HttpCode, HttpStatus, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiCreatedResponse, ApiTags } from '@nestjs/swagger';
import type { Member } from '@plummet/shared';
import { CurrentUser, Roles } from './auth.decorators.js';
import type { AuthUser } from './auth.types.js';
import { InvitationCreateDto } from './auth.dto.js';
import { InvitationsService } from './invitations.service.js';
import { MemberDto } from '../users/users.dto.js';

/** `POST /api/users/invitations` lives with auth because accepting one opens a session. */
@ApiTags('users')
@ApiBearerAuth()
@Controller('users/invitations')
export class InvitationsController {
  constructor(private readonly invitations: InvitationsService) {}

  @Post()
  @Roles('admin')
  @HttpCode(HttpStatus.CREATED)
  @ApiCreatedResponse({ type: MemberDto.Output })
  invite(@CurrentUser() admin: AuthUser, @Body() body: InvitationCreateDto): Promise<Member> {
    return this.invitations.invite(admin, body);
  }
}
