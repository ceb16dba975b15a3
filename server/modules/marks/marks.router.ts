/**
 * Mark routes, mounted at the API root (app.ts):
 *   GET    /captures/:captureId/marks   a capture's marks and the band they may sit in (any member)
 *   POST   /captures/:captureId/marks   add a mark (owner, analyst)
 *   PATCH  /marks/:id                   edit a mark (its author, or an owner)
 *   DELETE /marks/:id                   delete a mark (its author, or an owner)
 */
import { Router } from 'express';
import { CreateMarkRequest, UpdateMarkRequest, type MarkResponse, type MarksResponse } from '../../contracts/marks';
import { routeParam } from '../../lib/route-param';
import { currentAuth, requireUser } from '../../middleware/session';
import type { MarksService } from './marks.service';

export function createMarksRouter({ marks }: { marks: MarksService }): Router {
  const router = Router();

  router.get('/captures/:captureId/marks', requireUser, async (req, res) => {
    res.json((await marks.list(currentAuth(res).user.id, routeParam(req, 'captureId'))) satisfies MarksResponse);
  });

  router.post('/captures/:captureId/marks', requireUser, async (req, res) => {
    const mark = await marks.create(currentAuth(res).user.id, routeParam(req, 'captureId'), () => CreateMarkRequest.parse(req.body ?? {}));
    res.status(201).json({ mark } satisfies MarkResponse);
  });

  router.patch('/marks/:id', requireUser, async (req, res) => {
    const mark = await marks.update(currentAuth(res).user.id, routeParam(req, 'id'), () => UpdateMarkRequest.parse(req.body ?? {}));
    res.json({ mark } satisfies MarkResponse);
  });

  router.delete('/marks/:id', requireUser, async (req, res) => {
    await marks.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
