/**
 * Stability routes, mounted at the API root (app.ts):
 *   GET /analyses/:id/allan   the overlapping Allan deviation of the analysis's capture (any member of the bench)
 */
import { Router } from 'express';
import type { AllanResponse } from '../../contracts/stability';
import { routeParam } from '../../lib/route-param';
import { currentAuth, requireUser } from '../../middleware/session';
import type { StabilityService } from './stability.service';

export function createStabilityRouter(stability: StabilityService): Router {
  const router = Router();
  router.get('/analyses/:id/allan', requireUser, async (req, res) => {
    res.json((await stability.allan(currentAuth(res).user.id, routeParam(req, 'id'))) satisfies AllanResponse);
  });
  return router;
}
