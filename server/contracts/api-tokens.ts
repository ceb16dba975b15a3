/**
 * Personal API token contracts. A token acts as its owner: the same bench roles, no more.
 *   GET    /api/me/tokens                          -> ApiTokenListResponse (never the secrets)
 *   POST   /api/me/tokens  CreateApiTokenRequest   -> 201 CreatedApiTokenResponse (the secret, once)
 *   DELETE /api/me/tokens/:id                      -> 204 (revoked; 404 when not yours or already revoked)
 * Scripts send the secret as `Authorization: Bearer <secret>`; an unknown, revoked or expired token
 * answers 401 `unauthenticated` with a message saying which.
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

/** Every secret starts with this, so a leaked one is easy to recognise in logs and scanners. */
export const API_TOKEN_SECRET_PREFIX = 'plm_';
/** How many characters of the secret (prefix included) are kept in clear to tell tokens apart. */
export const API_TOKEN_VISIBLE_CHARS = 12;

export const ApiToken = z.object({
  id: Id,
  name: z.string(),
  /** The first characters of the secret, e.g. "plm_k3v9x2ab" — enough to recognise it, not to use it. */
  prefix: z.string(),
  createdAt: Timestamp,
  expiresAt: Timestamp.nullable(),
  lastUsedAt: Timestamp.nullable(),
});
export type ApiToken = z.infer<typeof ApiToken>;

export const CreateApiTokenRequest = z.object({
  /** What the token is for, e.g. "lab PC upload script". */
  name: DisplayName,
  /** Optional end of validity (ISO 8601, in the future); without it the token lasts until revoked. */
  expiresAt: Timestamp.optional(),
});
export type CreateApiTokenRequest = z.input<typeof CreateApiTokenRequest>;

export const ApiTokenListResponse = z.object({ tokens: z.array(ApiToken) });
export type ApiTokenListResponse = z.infer<typeof ApiTokenListResponse>;

export const CreatedApiTokenResponse = z.object({
  token: ApiToken,
  /** The whole secret. Shown in this reply only: the server keeps its sha256, never the secret. */
  secret: z.string(),
});
export type CreatedApiTokenResponse = z.infer<typeof CreatedApiTokenResponse>;
