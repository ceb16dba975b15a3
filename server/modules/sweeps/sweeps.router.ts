/**
 * GET /benches/:benchId/lasers/:laserId/sweep?parameter=… (any member), mounted at the API root;
 * relies on app.ts's requireUser + loadBenchAccess for /benches/:benchId.
 */
import { Router } from 'express';
import { SweepQuery, type SweepResponse } from '../../contracts/sweeps';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { requireUser } from '../../middleware/session';
import type { SweepsService } from './sweeps.service';

export function createSweepsRouter({ sweeps }: { sweeps: SweepsService }): Router {
  const router = Router();
  router.get('/benches/:benchId/lasers/:laserId/sweep', requireUser, async (req, res) => {
    const access = benchAccessOf(res);
    const { parameter } = SweepQuery.parse(req.query);
    res.json((await sweeps.sweep(access, routeParam(req, 'laserId'), parameter)) satisfies SweepResponse);
  });
  return router;
}
