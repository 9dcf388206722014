import { Body, Controller, HttpCode, HttpStatus, Post, Req } from '@nestjs/common';
import { ApiOkResponse, ApiTags, ApiTooManyRequestsResponse } from '@nestjs/swagger';
import type { Session } from '@plummet/shared';
import type { Request } from 'express';
import { Public } from './auth.decorators.js';
import {
  InvitationAcceptDto,
  PasswordResetConfirmDto,
  PasswordResetRequestDto,
  SessionDto,
  SessionRefreshDto,
  SignInDto,
} from './auth.dto.js';
import { AuthService } from './auth.service.js';
import { InvitationsService } from './invitations.service.js';
import { PasswordResetService } from './password-reset.service.js';
import { SessionsService } from './sessions.service.js';

/** The client's address as Express sees it (X-Forwarded-For only from proxies trusted by TRUST_PROXY). */
function clientAddress(req: Request): string {
  return req.ip ?? req.socket.remoteAddress ?? 'unknown';
}

/** Routes that work without an access token: they are how one is obtained. */
@Public()
@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly sessions: SessionsService,
    private readonly invitations: InvitationsService,
    private readonly passwordReset: PasswordResetService,
  ) {}

  @Post('sign-in')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ type: SessionDto.Output })
  @ApiTooManyRequestsResponse({ description: 'Too many attempts for this account or address; see Retry-After' })
  signIn(@Body() body: SignInDto, @Req() req: Request): Promise<Session> {
    return this.auth.signIn(body, clientAddress(req));
  }

  /** Exchanges a refresh token (single use) for a new session. */
  @Post('refresh')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ type: SessionDto.Output })
  refresh(@Body() body: SessionRefreshDto): Promise<Session> {
    return this.sessions.refresh(body.refreshToken);
  }

  /** Ends the session of that refresh token on every device it was renewed on. Always 204. */
  @Post('sign-out')
  @HttpCode(HttpStatus.NO_CONTENT)
  signOut(@Body() body: SessionRefreshDto): Promise<void> {
    return this.sessions.signOut(body.refreshToken);
  }

  @Post('accept-invite')
  @HttpCode(HttpStatus.OK)
  @ApiOkResponse({ type: SessionDto.Output })
  acceptInvite(@Body() body: InvitationAcceptDto): Promise<Session> {
    return this.invitations.accept(body);
  }

  /** 202 whatever the address: a link is sent only if it belongs to an active account. */
  @Post('password-reset')
  @HttpCode(HttpStatus.ACCEPTED)
  async requestPasswordReset(@Body() body: PasswordResetRequestDto, @Req() req: Request): Promise<{ message: string }> {
    await this.passwordReset.request(body.email, clientAddress(req));
    return { message: 'If the address belongs to an account, a reset link is on its way' };
  }

  @Post('password-reset/confirm')
  @HttpCode(HttpStatus.NO_CONTENT)
  confirmPasswordReset(@Body() body: PasswordResetConfirmDto): Promise<void> {
    return this.passwordReset.confirm(body);
  }
}
