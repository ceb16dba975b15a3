/**
 * Auth contracts.
 *   POST /api/auth/sign-up  SignUpRequest  -> 201 UserResponse + session cookie
 *   POST /api/auth/sign-in  SignInRequest  -> 200 UserResponse + session cookie (401 invalid_credentials)
 *   POST /api/auth/sign-out                -> 204
 *   GET  /api/me                           -> 200 UserResponse (401 unauthenticated)
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

export const PASSWORD_MIN_LENGTH = 12;
export const PASSWORD_MAX_LENGTH = 256;

/** E-mail, trimmed and lower-cased before it is checked. */
export const Email = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'must be at most 254 characters')
  .pipe(z.email('must be an e-mail address'));

export const SignUpRequest = z.object({
  email: Email,
  name: DisplayName,
  password: z
    .string()
    .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(PASSWORD_MAX_LENGTH, `must be at most ${PASSWORD_MAX_LENGTH} characters`),
});
export type SignUpRequest = z.input<typeof SignUpRequest>;

export const SignInRequest = z.object({
  email: Email,
  password: z
    .string()
    .min(1, 'must not be empty')
    .max(PASSWORD_MAX_LENGTH, `must be at most ${PASSWORD_MAX_LENGTH} characters`),
});
export type SignInRequest = z.input<typeof SignInRequest>;

export const User = z.object({
  id: Id,
  email: z.string(),
  name: z.string(),
  createdAt: Timestamp,
});
export type User = z.infer<typeof User>;

export const UserResponse = z.object({ user: User });
export type UserResponse = z.infer<typeof UserResponse>;
