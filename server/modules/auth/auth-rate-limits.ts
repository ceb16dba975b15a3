/**
 * Rate limits for sign-in and sign-up (express-rate-limit, in-memory store per process).
 * - sign-in: `signIn.limit` failed attempts per client address and e-mail per window (successful
 *   sign-ins do not count);
 * - sign-up: `signUp.limit` attempts per client address per window.
 * Above the limit: 429 `rate_limited` in the JSON error shape, with RateLimit/Retry-After headers.
 * The client address is req.ip, which honours PHASELOOM_TRUST_PROXY. Several server processes keep
 * separate counts; a shared store would be needed to make the limit exact across them.
 */
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { AppError } from '../../errors';

export interface AuthRateLimits {
  windowMs: number;
  signIn: { limit: number };
  signUp: { limit: number };
}

function minutes(ms: number): string {
  const m = Math.max(1, Math.ceil(ms / 60_000));
  return m === 1 ? '1 minute' : `${m} minutes`;
}

function emailOf(req: Request): string {
  const email = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

export function signInRateLimit(limits: AuthRateLimits): RequestHandler {
  return rateLimit({
    windowMs: limits.windowMs,
    limit: limits.signIn.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${emailOf(req)}`,
    handler: (_req, _res, next) =>
      next(
        new AppError(
          429,
          'rate_limited',
          `too many sign-in attempts for this e-mail; wait ${minutes(limits.windowMs)} and try again`,
        ),
      ),
  });
}

export function signUpRateLimit(limits: AuthRateLimits): RequestHandler {
  return rateLimit({
    windowMs: limits.windowMs,
    limit: limits.signUp.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) =>
      next(
        new AppError(
          429,
          'rate_limited',
          `too many sign-ups from this address; wait ${minutes(limits.windowMs)} and try again`,
        ),
      ),
  });
}
