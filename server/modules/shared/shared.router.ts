/**
 * GET /shared/:token — a shared spectrum or overlay, no sign-in (mounted at /api). Unknown token 404,
 * revoked or expired 410 `gone` in the JSON error shape. Rate-limited per client address
 * (express-rate-limit, in-memory per process) so tokens cannot be tried in bulk.
 */
import { Router } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { SHARE_GONE_CODE, type SharedResponse } from '../../contracts/share-links';
import { AppError } from '../../errors';
import { routeParam } from '../../lib/route-param';
import type { SharedService } from './shared.service';

export interface SharedRateLimit {
  windowMs: number;
  limit: number;
}

/** Modest: a reader reloads a page a few times; a token hunt is thousands of requests. */
export const DEFAULT_SHARED_RATE_LIMIT: SharedRateLimit = { windowMs: 60_000, limit: 60 };

export function createSharedRouter({ shared, rateLimit: limits = DEFAULT_SHARED_RATE_LIMIT }: { shared: SharedService; rateLimit?: SharedRateLimit }): Router {
  const router = Router();
  router.use(
    '/shared',
    rateLimit({
      windowMs: limits.windowMs,
      limit: limits.limit,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
      handler: (_req, _res, next) => next(new AppError(429, 'rate_limited', 'too many requests for shared links; wait a minute and try again')),
    }),
  );
  router.get('/shared/:token', async (req, res) => {
    const outcome = await shared.open(routeParam(req, 'token'));
    if (outcome.gone) {
      res.status(410).json({ error: { code: SHARE_GONE_CODE, message: outcome.message } });
      return;
    }
    res.json(outcome.body satisfies SharedResponse);
  });
  return router;
}
