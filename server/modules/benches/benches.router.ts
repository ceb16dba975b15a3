/**
 * /api/benches and /api/benches/:benchId. Mounted behind requireUser; the :benchId routes behind
 * loadBenchAccess (see app.ts).
 */
import { Router } from 'express';
import {
  CreateBenchRequest,
  UpdateBenchRequest,
  type BenchListResponse,
  type BenchResponse,
} from '../../contracts/benches';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import { currentAuth } from '../../middleware/session';
import type { BenchesService } from './benches.service';

export function benchesRouter(benches: BenchesService): Router {
  const router = Router();

  router.get('/', async (_req, res) => {
    const list = await benches.list(currentAuth(res).user.id);
    res.json({ benches: list } satisfies BenchListResponse);
  });

  router.post('/', async (req, res) => {
    const input = CreateBenchRequest.parse(req.body);
    const bench = await benches.create(currentAuth(res).user.id, input);
    res.status(201).json({ bench } satisfies BenchResponse);
  });

  router.get('/:benchId', allow('bench.read'), async (_req, res) => {
    const bench = await benches.get(benchAccessOf(res));
    res.json({ bench } satisfies BenchResponse);
  });

  router.patch('/:benchId', allow('bench.update'), async (req, res) => {
    const input = UpdateBenchRequest.parse(req.body);
    const bench = await benches.update(benchAccessOf(res), input);
    res.json({ bench } satisfies BenchResponse);
  });

  router.delete('/:benchId', allow('bench.delete'), async (_req, res) => {
    await benches.remove(benchAccessOf(res));
    res.status(204).end();
  });

  return router;
}
