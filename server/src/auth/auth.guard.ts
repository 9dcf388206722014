import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import { ROLE_VALUES, type Role } from '@plummet/shared';
import type { Request } from 'express';
import { AppError, ErrorCode } from '../common/app-error.js';
import { IS_PUBLIC, ROLES } from './auth.decorators.js';
import type { AccessTokenClaims, AuthUser } from './auth.types.js';

/**
 * Global guard: every route needs a valid access JWT unless marked @Public(); @Roles() narrows
 * it further. Stateless, so any replica can check any token.
 */
@Injectable()
export class AuthGuard implements CanActivate {
  constructor(
    private readonly jwt: JwtService,
    private readonly reflector: Reflector,
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
    req.user = { userId: claims.sub, organisationId: claims.org, role: claims.role };
    const allowed = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES, targets);
    if (allowed && !allowed.includes(claims.role)) {
      throw new AppError(ErrorCode.Forbidden, 'Your role does not allow this');
    }
    return true;
  }
}
