/**
 * /api/password-resets (request a link), /check (is the link usable) and /confirm (new password).
 * No sign-in needed. Requests are rate-limited per client address and e-mail like sign-in attempts.
 */
import { Router, type RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import {
  PasswordResetConfirmRequest,
  PasswordResetRequest,
  PasswordResetTokenRequest,
  type PasswordResetCheckResponse,
  type PasswordResetRequestedResponse,
} from '../../contracts/password-resets';
import { AppError } from '../../errors';
import { authOf } from '../../middleware/session';
import type { AuthRateLimits } from '../auth/auth-rate-limits';
import { PASSWORD_RESET_REQUESTED_MESSAGE, type PasswordResetsService } from './password-resets.service';

/** As many reset requests per client address and e-mail per window as failed sign-ins. */
function requestRateLimit(limits: AuthRateLimits): RequestHandler {
  return rateLimit({
    windowMs: limits.windowMs,
    limit: limits.signIn.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => {
      const email = (req.body as { email?: unknown } | undefined)?.email;
      return `${ipKeyGenerator(req.ip ?? '')}|${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
    },
    handler: (_req, _res, next) =>
      next(new AppError(429, 'rate_limited', 'too many password-reset requests for this e-mail; wait a while and try again')),
  });
}

export function passwordResetsRouter(resets: PasswordResetsService, limits: AuthRateLimits): Router {
  const router = Router();
  const requestLimit = requestRateLimit(limits);

  router.post('/password-resets', requestLimit, async (req, res) => {
    const { email } = PasswordResetRequest.parse(req.body);
    resets.request(email);
    res.status(202).json({ message: PASSWORD_RESET_REQUESTED_MESSAGE } satisfies PasswordResetRequestedResponse);
  });

  router.post('/password-resets/check', async (req, res) => {
    const { token } = PasswordResetTokenRequest.parse(req.body);
    res.json((await resets.check(token)) satisfies PasswordResetCheckResponse);
  });

  router.post('/password-resets/confirm', async (req, res) => {
    const input = PasswordResetConfirmRequest.parse(req.body);
    const current = authOf(res);
    await resets.confirm(input, current ? { userId: current.user.id, sessionId: current.session.id } : null);
    res.status(204).end();
  });

  return router;
}
