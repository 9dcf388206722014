import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import { ROLE_VALUES, type Role } from '@plummet/shared';
import type { Request } from 'express';
import { AppError, ErrorCode } from '../common/app-error.js';
import { IS_PUBLIC, ROLES } from './auth.decorators.js';
import type { AccessTokenClaims, AuthUser } from './auth.types.js';
import { SessionStateCache } from './session-state.cache.js';

/**
 * Global guard: every route needs a valid access JWT unless marked @Public(); @Roles() narrows
 * it further. Any replica can check any token: the signature, then the user's session version.
 */
@Injectable()
export class AuthGuard implements CanActivate {
  constructor(
    private readonly jwt: JwtService,
    private readonly reflector: Reflector,
    private readonly sessionStates: SessionStateCache,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const req = context.switchToHttp().getRequest<Request & { user?: AuthUser }>();
    const header = req.headers.authorization ?? '';
    const [scheme, token] = header.split(' ');
    if (scheme !== 'Bearer' || !token) throw new AppError(ErrorCode.Unauthenticated, 'Sign in first');
    let claims: AccessTokenClaims;
    try {
      claims = await this.jwt.verifyAsync<AccessTokenClaims>(token);
    } catch {
      throw new AppError(ErrorCode.Unauthenticated, 'The session has expired; sign in again');
    }
    if (!claims.sub || !claims.org || !ROLE_VALUES.includes(claims.role)) {
      throw new AppError(ErrorCode.Unauthenticated, 'The access token is not valid');
    }
    // Signatures alone cannot be revoked: the user's session version in PostgreSQL (cached a few seconds) can.
    const state = await this.sessionStates.get(claims.sub, claims.org);
    if (!state || !state.active || state.sessionVersion !== (claims.ver ?? 0)) {
      throw new AppError(ErrorCode.Unauthenticated, 'The session was ended; sign in again');
    }
    req.user = { userId: claims.sub, organisationId: claims.org, role: claims.role };
    const allowed = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES, targets);
    if (allowed && !allowed.includes(claims.role)) {
      throw new AppError(ErrorCode.Forbidden, 'Your role does not allow this');
    }
    return true;
  }
}
