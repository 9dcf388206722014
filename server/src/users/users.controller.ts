import { Body, Controller, Get, Param, Patch, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { ForemanListResponse, Member, MemberListResponse, UserProfile } from '@plummet/shared';
import { CurrentUser, Roles } from '../auth/auth.decorators.js';
import type { AuthUser } from '../auth/auth.types.js';
import { ForemanListResponseDto, MemberDto, MemberListResponseDto, MemberListQueryDto, MemberUpdateDto, UserProfileDto, UserProfileUpdateDto } from './users.dto.js';
import { UsersService } from './users.service.js';

@ApiTags('users')
@ApiBearerAuth()
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  /** Any signed-in user: their own profile in the organisation of their session. */
  @Get('me')
  @ApiOkResponse({ type: UserProfileDto.Output })
  me(@CurrentUser() caller: AuthUser): Promise<UserProfile> {
    return this.users.me(caller);
  }

  @Patch('me')
  @ApiOkResponse({ type: UserProfileDto.Output })
  updateMe(@CurrentUser() caller: AuthUser, @Body() body: UserProfileUpdateDto): Promise<UserProfile> {
    return this.users.updateMe(caller, body);
  }

  /** Who a finding can be handed to: inspectors and managers assign, admins manage. */
  @Get('foremen')
  @Roles('inspector', 'manager', 'admin')
  @ApiOkResponse({ type: ForemanListResponseDto.Output })
  foremen(@CurrentUser() caller: AuthUser): Promise<ForemanListResponse> {
    return this.users.foremen(caller);
  }

  @Get()
  @Roles('admin')
  @ApiOkResponse({ type: MemberListResponseDto.Output })
  list(@CurrentUser() caller: AuthUser, @Query() query: MemberListQueryDto): Promise<MemberListResponse> {
    return this.users.list(caller, query);
  }

  @Patch(':id')
  @Roles('admin')
  @ApiOkResponse({ type: MemberDto.Output })
  updateMember(@CurrentUser() caller: AuthUser, @Param('id') id: string, @Body() body: MemberUpdateDto): Promise<Member> {
    return this.users.updateMember(caller, id, body);
  }
}
