/**
 * Shared building blocks of the HTTP contracts: ids, timestamps, the one error shape.
 * Contracts import only zod: the client imports these files as they are.
 */
import { z } from 'zod';

/** Random URL-safe id (24 characters of lower-case base32), never an auto-increment number. */
export const Id = z.string().regex(/^[a-z2-7]{24}$/, 'not a valid id');
export type Id = z.infer<typeof Id>;

/** Timestamps travel as ISO 8601 strings in UTC, e.g. "2026-12-01T12:00:00.000Z". */
export const Timestamp = z.iso.datetime();

/** Error codes the server answers with. */
export const ErrorCode = z.enum([
  'validation_failed', // 400: a body, query or parameter broke its schema; details name each field
  'bad_input', // 400: a capture or analysis option cannot be used (AnalysisInputError)
  'bad_json', // 400: the body is not valid JSON
  'unauthenticated', // 401: no valid session
  'invalid_credentials', // 401: sign-in failed (one message for wrong e-mail and wrong password)
  'forbidden', // 403: a member whose role does not allow the action
  'bad_origin', // 403: a state-changing request from another site
  'not_found', // 404: no such thing, or not visible to you
  'conflict', // 409: duplicate name or e-mail, last owner rules
  'gone', // 410: a single-use or expiring link that was used, revoked or has expired
  'payload_too_large', // 413
  'rate_limited', // 429
  'internal', // 500
]);
export type ErrorCode = z.infer<typeof ErrorCode>;

export const ErrorDetail = z.object({
  /** Dotted path of the field, e.g. "password" or "lasers.0.name"; "" for the whole body. */
  path: z.string(),
  message: z.string(),
});
export type ErrorDetail = z.infer<typeof ErrorDetail>;

/** The one JSON error shape: `{ "error": { "code", "message", "details"? } }`. */
export const ErrorResponse = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.array(ErrorDetail).optional(),
  }),
});
export type ErrorResponse = z.infer<typeof ErrorResponse>;

/** Trimmed display name of a thing (bench, laser, person). */
export const DisplayName = z
  .string()
  .trim()
  .min(1, 'must not be empty')
  .max(120, 'must be at most 120 characters');

/** Optional free text: trimmed; an empty string is stored as null. */
export const FreeText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `must be at most ${max} characters`)
    .transform((s) => (s === '' ? null : s));
