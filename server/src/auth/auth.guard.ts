import { type CanActivate, type ExecutionContext, Inject, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { JwtService } from '@nestjs/jwt';
import { ROLE_VALUES, type Role } from '@plummet/shared';
import type { Request } from 'express';
import { AppError, ErrorCode } from '../common/app-error.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { isOrganisationId } from '../db/organisation-context.js';
import { ACCEPTS_ENDED_SESSION, IS_PUBLIC, ROLES } from './auth.decorators.js';
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
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async canActivate(context: ExecutionContext): Promise<boolean> {
    const targets = [context.getHandler(), context.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC, targets)) return true;
    const req = context.switchToHttp().getRequest<Request & { user?: AuthUser }>();
    const header = req.headers.authorization ?? '';
    const [scheme, token] = header.split(' ');
    if (scheme !== 'Bearer' || !token) throw new AppError(ErrorCode.Unauthenticated, 'Sign in first');
    const acceptsEnded = this.reflector.getAllAndOverride<boolean>(ACCEPTS_ENDED_SESSION, targets) === true;
    let claims: AccessTokenClaims & { iat?: number };
    let ended = false;
    try {
      claims = await this.jwt.verifyAsync<AccessTokenClaims>(token);
    } catch {
      const late = acceptsEnded ? await this.endedSessionClaims(token) : null;
      if (!late) throw new AppError(ErrorCode.Unauthenticated, 'The session has expired; sign in again');
      claims = late;
      ended = true;
    }
    if (!claims.sub || !isOrganisationId(claims.org) || !ROLE_VALUES.includes(claims.role)) {
      throw new AppError(ErrorCode.Unauthenticated, 'The access token is not valid');
    }
    // Signatures alone cannot be revoked: the user's session version in PostgreSQL (cached a few seconds) can.
    const state = await this.sessionStates.get(claims.sub, claims.org);
    const current = !!state && state.active && state.sessionVersion === (claims.ver ?? 0);
    // An expired token of a user who may still refresh must refresh: only ended sessions pass late.
    if (ended && current) throw new AppError(ErrorCode.Unauthenticated, 'The session has expired; sign in again');
    // A deactivated member's work recorded offline is taken (and flagged) where the route allows it;
    // any other ended session (password reset, new role) must sign in or refresh first.
    const deactivated = !!state && !state.active;
    if (!current && !(acceptsEnded && deactivated)) throw new AppError(ErrorCode.Unauthenticated, 'The session was ended; sign in again');
    req.user = { userId: claims.sub, organisationId: claims.org, role: claims.role, ...(current ? {} : { sessionEnded: true as const }) };
    const allowed = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES, targets);
    if (allowed && !allowed.includes(claims.role)) {
      throw new AppError(ErrorCode.Forbidden, 'Your role does not allow this');
    }
    return true;
  }

  /** Claims of a token this server signed, expired but younger than the longest offline period. */
  private async endedSessionClaims(token: string): Promise<(AccessTokenClaims & { iat?: number }) | null> {
    try {
      const claims = await this.jwt.verifyAsync<AccessTokenClaims & { iat?: number }>(token, { ignoreExpiration: true });
      const oldestS = Date.now() / 1000 - this.config.SYNC_MUTATION_RETENTION_DAYS * 86_400;
      return claims.iat && claims.iat >= oldestS ? claims : null;
    } catch {
      return null;
    }
  }
}
