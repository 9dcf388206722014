/**
 * What sign-in, refresh and accepting an invitation answer, checked with shared's schemas, and
 * the session the phone keeps from it (session.ts). Apart from session.ts so that reading the
 * stored session at a start does not build the schemas.
 */
import { DateTimeSchema, SessionSchema, type Session } from '@plummet/shared';
import { ASSUMED_REFRESH_LIFETIME_MS, type StoredSession } from './session';

/** What sign-in and refresh answer, with the refresh token's expiry should the server add it. */
export const SessionResponseSchema = SessionSchema.extend({ refreshTokenExpiresAt: DateTimeSchema.optional() });

export function sessionFromResponse(response: unknown, now: Date, signedInAt?: string): StoredSession {
  const parsed = SessionResponseSchema.parse(response);
  const session: Session = parsed;
  return {
    accessToken: session.accessToken,
    refreshToken: session.refreshToken,
    user: session.user,
    signedInAt: signedInAt ?? now.toISOString(),
    refreshExpiresAt: parsed.refreshTokenExpiresAt ?? new Date(now.getTime() + ASSUMED_REFRESH_LIFETIME_MS).toISOString(),
  };
}
