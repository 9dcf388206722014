import { z } from 'zod';
import { EmailSchema } from '../users/user.schema.js';
import { OpaqueTokenSchema } from './session.schema.js';

export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 200;

/** The password policy: long enough to resist guessing, short enough to hash cheaply. */
export const PasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters`);

/** `POST /api/auth/accept-invite`: the invitation link's token and the new password. */
export const InvitationAcceptSchema = z.strictObject({ token: OpaqueTokenSchema, password: PasswordSchema });
export type InvitationAccept = z.infer<typeof InvitationAcceptSchema>;

/** `POST /api/auth/password-reset`: always answered 202, whether or not the address is known. */
export const PasswordResetRequestSchema = z.strictObject({ email: EmailSchema });
export type PasswordResetRequest = z.infer<typeof PasswordResetRequestSchema>;

/** `POST /api/auth/password-reset/confirm`: the reset link's token and the new password. */
export const PasswordResetConfirmSchema = z.strictObject({ token: OpaqueTokenSchema, password: PasswordSchema });
export type PasswordResetConfirm = z.infer<typeof PasswordResetConfirmSchema>;
