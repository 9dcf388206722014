import type { Role } from '@plummet/shared';

/** What a verified access token says about its bearer; set on `request.user` by the guard. */
export interface AuthUser {
  userId: string;
  organisationId: string;
  role: Role;
  /** Set only on routes marked @AcceptsEndedSession when the token's session has ended. */
  sessionEnded?: true;
}

/** Claims inside the access JWT. */
export interface AccessTokenClaims {
  sub: string;
  org: string;
  role: Role;
  /** The user's session version when the token was made; absent in tokens made before versions existed (read as 0). */
  ver?: number;
}
