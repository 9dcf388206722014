/**
 * The session kept on the phone: the tokens from sign-in and the user's profile. Pure helpers;
 * session.store.ts keeps it in the database.
 */
import { DateTimeSchema, defaultWindUnitsFor, SessionSchema, UserProfileSchema, type Session, type UserProfile } from '@plummet/shared';

/**
 * How long a refresh token lives when the server does not say: the server's default
 * REFRESH_TOKEN_TTL_S (30 days, server/src/config/config.ts). Each refresh starts a new one.
 */
export const ASSUMED_REFRESH_LIFETIME_MS = 30 * 86_400_000;

/** Refresh the access token this long before it expires, so a request never leaves with a stale one. */
export const ACCESS_TOKEN_MARGIN_MS = 30_000;

/** What sign-in and refresh answer, with the refresh token's expiry should the server add it. */
export const SessionResponseSchema = SessionSchema.extend({ refreshTokenExpiresAt: DateTimeSchema.optional() });

export interface StoredSession {
  accessToken: string;
  refreshToken: string;
  user: UserProfile;
  /** ISO date-time of the sign-in. */
  signedInAt: string;
  /** ISO date-time after which the phone can no longer renew the session: sign in again with a connection. */
  refreshExpiresAt: string;
}

/** A profile saved before wind had its own unit gets the one that goes with its display units. */
function withWindUnits(user: unknown): unknown {
  if (typeof user !== 'object' || user === null || 'windUnits' in user) return user;
  const units = (user as { units?: unknown }).units;
  return { ...user, windUnits: defaultWindUnitsFor(units === 'imperial' ? 'imperial' : 'si') };
}

/** A stored session read back from the database, or undefined when it is not one. */
export function restoreSession(value: unknown): StoredSession | undefined {
  if (typeof value !== 'object' || value === null) return undefined;
  const candidate = value as Record<string, unknown>;
  const user = UserProfileSchema.safeParse(withWindUnits(candidate.user));
  const texts = [candidate.accessToken, candidate.refreshToken];
  if (!user.success || !texts.every((text) => typeof text === 'string' && text.length > 0)) return undefined;
  const signedInAt = DateTimeSchema.safeParse(candidate.signedInAt);
  const refreshExpiresAt = DateTimeSchema.safeParse(candidate.refreshExpiresAt);
  if (!signedInAt.success || !refreshExpiresAt.success) return undefined;
  return {
    accessToken: candidate.accessToken as string,
    refreshToken: candidate.refreshToken as string,
    user: user.data,
    signedInAt: signedInAt.data,
    refreshExpiresAt: refreshExpiresAt.data,
  };
}

export type SessionStatus = 'signed-out' | 'expired' | 'active';

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

export function sessionStatus(session: StoredSession | undefined, now: Date = new Date()): SessionStatus {
  if (!session) return 'signed-out';
  return Date.parse(session.refreshExpiresAt) <= now.getTime() ? 'expired' : 'active';
}

/** The `exp` of a JWT as ms since the epoch, or undefined when the token is not a readable JWT. */
export function accessTokenExpiry(token: string): number | undefined {
  const payload = token.split('.')[1];
  if (!payload) return undefined;
  try {
    const json = atob(payload.replace(/-/g, '+').replace(/_/g, '/').padEnd(Math.ceil(payload.length / 4) * 4, '='));
    const exp = (JSON.parse(json) as { exp?: unknown }).exp;
    return typeof exp === 'number' ? exp * 1000 : undefined;
  } catch {
    return undefined;
  }
}

/** True when the access token is (nearly) expired and should be renewed before use. */
export function accessTokenNeedsRefresh(token: string, now: Date = new Date()): boolean {
  const expiry = accessTokenExpiry(token);
  return expiry === undefined ? false : expiry - ACCESS_TOKEN_MARGIN_MS <= now.getTime();
}
