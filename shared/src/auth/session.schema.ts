import { z } from 'zod';
import { EmailSchema, UserProfileSchema } from '../users/user.schema.js';

/** Opaque tokens (refresh, invitation, reset) are 32 random bytes in base64url: 43 characters. */
export const OpaqueTokenSchema = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'Not a valid token');

/** Sign-in does not apply the password policy (it may have changed since); it only bounds the size. */
export const SignInSchema = z.strictObject({
  email: EmailSchema,
  password: z.string().min(1).max(200),
});
export type SignIn = z.infer<typeof SignInSchema>;

/** What sign-in, refresh and accepting an invitation answer. */
export const SessionSchema = z.object({
  /** Short-lived JWT for `Authorization: Bearer …`. */
  accessToken: z.string(),
  /** Single-use: exchange it at `POST /api/auth/refresh` for a new session. */
  refreshToken: z.string(),
  user: UserProfileSchema,
});
export type Session = z.infer<typeof SessionSchema>;

/** `POST /api/auth/refresh` and `POST /api/auth/sign-out`. */
export const SessionRefreshSchema = z.strictObject({ refreshToken: OpaqueTokenSchema });
export type SessionRefresh = z.infer<typeof SessionRefreshSchema>;
