/** POST /laser-estimates (any signed-in user; nothing is stored), mounted at the API root (app.ts). */
import { Router } from 'express';
import { LaserEstimateRequest, type LaserEstimateResponse } from '../../contracts/laser-estimates';
import { requireUser } from '../../middleware/session';
import { estimateLaser } from './laser-estimates.service';

export function createLaserEstimatesRouter(): Router {
  const router = Router();
  router.post('/laser-estimates', requireUser, (req, res) => {
    res.json(estimateLaser(LaserEstimateRequest.parse(req.body)) satisfies LaserEstimateResponse);
  });
  return router;
}
