/**
 * Simulation routes, mounted at the API root (app.ts):
 *   POST /benches/:benchId/simulations   202 (owner, analyst; role checked before the body)
 *   GET  /benches/:benchId/simulations   any member
 *   GET  /simulations/:id                any member of its bench
 * The /benches/:benchId routes rely on app.ts's requireUser + loadBenchAccess for /benches/:benchId.
 */
import { Router } from 'express';
import { CreateSimulationRequest, type SimulationListResponse, type SimulationResponse } from '../../contracts/simulations';
import { routeParam } from '../../lib/route-param';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import { assertCaptureAction } from '../captures/capture-policy';
import type { SimulationsService } from './simulations.service';

export function createSimulationsRouter(simulations: SimulationsService): Router {
  const router = Router();

  router.post(
    '/benches/:benchId/simulations',
    (_req, res, next) => {
      assertCaptureAction(benchAccessOf(res), 'captures.write');
      next();
    },
    async (req, res) => {
      const input = CreateSimulationRequest.parse(req.body);
      const simulation = await simulations.create(benchAccessOf(res), input);
      res.status(202).json({ simulation } satisfies SimulationResponse);
    },
  );

  router.get('/benches/:benchId/simulations', allow('bench.read'), async (_req, res) => {
    res.json({ simulations: await simulations.list(benchAccessOf(res)) } satisfies SimulationListResponse);
  });

  router.get('/simulations/:id', requireUser, async (req, res) => {
    res.json({ simulation: await simulations.get(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies SimulationResponse);
  });

  return router;
}
