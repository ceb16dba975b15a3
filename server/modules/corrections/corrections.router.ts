/**
 * Correction routes, mounted at the API root (app.ts):
 *   POST   /analyses/:id/corrections   a new correction of the analysis's S_ν (owner, analyst)
 *   GET    /analyses/:id/corrections   its corrections, newest first (any member)
 *   GET    /corrections/:id            one (any member)
 *   DELETE /corrections/:id            (owner, analyst)
 */
import { Router } from 'express';
import { CreateCorrectionRequest, type CorrectionListResponse, type CorrectionResponse } from '../../contracts/corrections';
import { routeParam } from '../../lib/route-param';
import { currentAuth, requireUser } from '../../middleware/session';
import type { CorrectionsService } from './corrections.service';

export function createCorrectionsRouter(corrections: CorrectionsService): Router {
  const router = Router();

  router.post('/analyses/:id/corrections', requireUser, async (req, res) => {
    const correction = await corrections.create(currentAuth(res).user.id, routeParam(req, 'id'), () => CreateCorrectionRequest.parse(req.body ?? {}));
    res.status(201).json({ correction } satisfies CorrectionResponse);
  });

  router.get('/analyses/:id/corrections', requireUser, async (req, res) => {
    res.json({ corrections: await corrections.list(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies CorrectionListResponse);
  });

  router.get('/corrections/:id', requireUser, async (req, res) => {
    res.json({ correction: await corrections.get(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies CorrectionResponse);
  });

  router.delete('/corrections/:id', requireUser, async (req, res) => {
    await corrections.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
