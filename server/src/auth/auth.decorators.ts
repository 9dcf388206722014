import { createParamDecorator, type ExecutionContext, SetMetadata } from '@nestjs/common';
import type { Role } from '@plummet/shared';
import type { AuthUser } from './auth.types.js';

export const IS_PUBLIC = 'plummet:public';
export const ROLES = 'plummet:roles';

/** The route needs no access token (sign-in, health, invitation links). */
export const Public = () => SetMetadata(IS_PUBLIC, true);

export const ACCEPTS_ENDED_SESSION = 'plummet:accepts-ended-session';

/**
 * The route also takes the token of a member deactivated since it was issued (even expired, if
 * signed within SYNC_MUTATION_RETENTION_DAYS); `user.sessionEnded` is then set.
 * Only for handing in work recorded offline, which is kept and flagged rather than lost.
 */
export const AcceptsEndedSession = () => SetMetadata(ACCEPTS_ENDED_SESSION, true);

/** Only these roles may call the route; others get 403 FORBIDDEN. */
export const Roles = (...roles: Role[]) => SetMetadata(ROLES, roles);

/** The signed-in caller (user, organisation, role). */
export const CurrentUser = createParamDecorator((_data: unknown, ctx: ExecutionContext): AuthUser => {
  return ctx.switchToHttp().getRequest<{ user: AuthUser }>().user;
});
