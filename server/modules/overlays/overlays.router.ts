/**
 * Overlay routes, mounted at the API root (app.ts):
 *   GET    /benches/:benchId/overlays   list (any member)
 *   POST   /benches/:benchId/overlays   create (owner, analyst)
 *   GET    /overlays/:id                one, with traces, figures and display series (any member)
 *   PATCH  /overlays/:id                rename or change the traces (owner, analyst)
 *   DELETE /overlays/:id                (owner, analyst)
 * The /benches/:benchId routes rely on app.ts's requireUser + loadBenchAccess for /benches/:benchId.
 */
import { Router } from 'express';
import {
  CreateOverlayRequest,
  UpdateOverlayRequest,
  type OverlayListResponse,
  type OverlayResponse,
} from '../../contracts/overlays';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import type { OverlaysService } from './overlays.service';

export function createOverlaysRouter({ overlays }: { overlays: OverlaysService }): Router {
  const router = Router();

  router.get('/benches/:benchId/overlays', requireUser, async (_req, res) => {
    res.json({ overlays: await overlays.list(benchAccessOf(res)) } satisfies OverlayListResponse);
  });

  router.post('/benches/:benchId/overlays', requireUser, async (req, res) => {
    // the role is checked before the body: a refused member learns nothing about validation
    const overlay = await overlays.create(benchAccessOf(res), () => CreateOverlayRequest.parse(req.body));
    res.status(201).json({ overlay } satisfies OverlayResponse);
  });

  router.get('/overlays/:id', requireUser, async (req, res) => {
    res.json({ overlay: await overlays.get(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies OverlayResponse);
  });

  router.patch('/overlays/:id', requireUser, async (req, res) => {
    const overlay = await overlays.update(currentAuth(res).user.id, routeParam(req, 'id'), () => UpdateOverlayRequest.parse(req.body));
    res.json({ overlay } satisfies OverlayResponse);
  });

  router.delete('/overlays/:id', requireUser, async (req, res) => {
    await overlays.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
