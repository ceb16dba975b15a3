/** /api/benches/:benchId/lasers[/:laserId]. Mounted behind requireUser and loadBenchAccess (app.ts). */
import { Router } from 'express';
import {
  CreateLaserRequest,
  UpdateLaserRequest,
  type LaserListResponse,
  type LaserResponse,
} from '../../contracts/lasers';
import { routeParam } from '../../lib/route-param';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import type { LasersService } from './lasers.service';

export function lasersRouter(lasers: LasersService): Router {
  const router = Router({ mergeParams: true });

  router.get('/', allow('lasers.read'), async (_req, res) => {
    res.json({ lasers: await lasers.list(benchAccessOf(res)) } satisfies LaserListResponse);
  });

  router.post('/', allow('lasers.write'), async (req, res) => {
    const input = CreateLaserRequest.parse(req.body);
    const laser = await lasers.create(benchAccessOf(res), input);
    res.status(201).json({ laser } satisfies LaserResponse);
  });

  router.get('/:laserId', allow('lasers.read'), async (req, res) => {
    const laser = await lasers.get(benchAccessOf(res), routeParam(req, 'laserId'));
    res.json({ laser } satisfies LaserResponse);
  });

  router.patch('/:laserId', allow('lasers.write'), async (req, res) => {
    const input = UpdateLaserRequest.parse(req.body);
    const laser = await lasers.update(benchAccessOf(res), routeParam(req, 'laserId'), input);
    res.json({ laser } satisfies LaserResponse);
  });

  router.delete('/:laserId', allow('lasers.write'), async (req, res) => {
    await lasers.remove(benchAccessOf(res), routeParam(req, 'laserId'));
    res.status(204).end();
  });

  return router;
}
