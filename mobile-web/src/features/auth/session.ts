/**
 * The session kept on the phone: the tokens from sign-in and the user's profile. Pure helpers;
 * session.store.ts keeps it in the database.
 */
import { defaultWindUnitsFor, ROLE_VALUES, UNITS_VALUES, WIND_UNITS_VALUES, type UserProfile } from '@plummet/shared';

/**
 * How long a refresh token lives when the server does not say: the server's default
 * REFRESH_TOKEN_TTL_S (30 days, server/src/config/config.ts). Each refresh starts a new one.
 */
export const ASSUMED_REFRESH_LIFETIME_MS = 30 * 86_400_000;

/** Refresh the access token this long before it expires, so a request never leaves with a stale one. */
export const ACCESS_TOKEN_MARGIN_MS = 30_000;

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
function withWindUnits(user: Record<string, unknown>): Record<string, unknown> {
  if ('windUnits' in user) return user;
  return { ...user, windUnits: defaultWindUnitsFor(user.units === 'imperial' ? 'imperial' : 'si') };
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** An ISO 8601 date-time with a zone (Z or an offset), as the server and toISOString write it. */
const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(?::\d{2}(?:\.\d+)?)?(?:Z|[+-]\d{2}:?\d{2})$/;

const isRecord = (value: unknown): value is Record<string, unknown> => typeof value === 'object' && value !== null;
const isText = (value: unknown): value is string => typeof value === 'string';
const isOneOf = <T extends string>(values: readonly T[], value: unknown): value is T => values.includes(value as T);
const isDateTime = (value: unknown): value is string => isText(value) && DATE_TIME.test(value) && !Number.isNaN(Date.parse(value));

/**
 * The stored profile, checked by hand: it was checked against UserProfileSchema when it arrived
 * (sessionFromResponse), so reading it back needs its shape, not the schemas (building them is
 * a long task on a phone, at every start). Keeps the profile's own fields, as the schema did.
 */
function restoreProfile(value: unknown): UserProfile | undefined {
  if (!isRecord(value)) return undefined;
  const user = withWindUnits(value);
  const { id, email, name, position, units, windUnits, role, organisation, version } = user;
  if (!isText(id) || !UUID.test(id) || !isText(email) || !isText(name) || !isText(position)) return undefined;
  if (!isOneOf(UNITS_VALUES, units) || !isOneOf(WIND_UNITS_VALUES, windUnits) || !isOneOf(ROLE_VALUES, role)) return undefined;
  if (!isRecord(organisation) || !isText(organisation.id) || !UUID.test(organisation.id) || !isText(organisation.name)) return undefined;
  if (version !== undefined && !Number.isInteger(version)) return undefined;
  return {
    id,
    email,
    name,
    position,
    units,
    windUnits,
    role,
    organisation: { id: organisation.id, name: organisation.name },
    ...(version === undefined ? {} : { version: version as number }),
  };
}

/** A stored session read back from the database, or undefined when it is not one. */
export function restoreSession(value: unknown): StoredSession | undefined {
  if (!isRecord(value)) return undefined;
  const user = restoreProfile(value.user);
  const { accessToken, refreshToken, signedInAt, refreshExpiresAt } = value;
  if (!user || !isText(accessToken) || !isText(refreshToken) || accessToken.length === 0 || refreshToken.length === 0) return undefined;
  if (!isDateTime(signedInAt) || !isDateTime(refreshExpiresAt)) return undefined;
  return { accessToken, refreshToken, user, signedInAt, refreshExpiresAt };
}

export type SessionStatus = 'signed-out' | 'expired' | 'active';

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
