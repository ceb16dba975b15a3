/**
 * Password reset by e-mail ("forgot password"). The answer to a request is the same whether or not
 * an account has the address (no enumeration); the link (/reset-password/<token>) works once, for one
 * hour. Choosing the new password ends every other session of the account.
 *   POST /api/password-resets          PasswordResetRequest -> 202 PasswordResetRequestedResponse
 *   POST /api/password-resets/check    PasswordResetTokenRequest -> PasswordResetCheckResponse
 *   POST /api/password-resets/confirm  PasswordResetConfirmRequest -> 204
 * Unknown token: 404 not_found. Used or expired: 410 gone, nothing changed.
 */
import { z } from 'zod';
import { Email, PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './auth';
import { Timestamp } from './common';

export const PASSWORD_RESET_VALID_MINUTES = 60;

export const PasswordResetRequest = z.object({ email: Email });
export type PasswordResetRequest = z.input<typeof PasswordResetRequest>;

export const PasswordResetRequestedResponse = z.object({ message: z.string() });
export type PasswordResetRequestedResponse = z.infer<typeof PasswordResetRequestedResponse>;

export const PasswordResetToken = z.string().regex(/^[A-Za-z0-9_-]{43}$/, 'not a reset token');

export const PasswordResetTokenRequest = z.object({ token: PasswordResetToken });
export type PasswordResetTokenRequest = z.input<typeof PasswordResetTokenRequest>;

export const PasswordResetCheckResponse = z.object({ email: z.string(), expiresAt: Timestamp });
export type PasswordResetCheckResponse = z.infer<typeof PasswordResetCheckResponse>;

export const PasswordResetConfirmRequest = z.object({
  token: PasswordResetToken,
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(PASSWORD_MAX_LENGTH, `must be at most ${PASSWORD_MAX_LENGTH} characters`),
});
export type PasswordResetConfirmRequest = z.input<typeof PasswordResetConfirmRequest>;
