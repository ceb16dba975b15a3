/**
 * Analysis routes, mounted at the API root (app.ts):
 *   GET  /analyses/:id                 status, progress, settings, result (any member of the bench)
 *   GET  /analyses/:id/spectrum        a view of S_ν, log-binned (any member)
 *   GET  /analyses/:id/series.csv      the full series (any member)
 *   POST /captures/:id/analyses        a new analysis with other settings (owner, analyst)
 *   POST /analyses/:id/retry           a failed analysis back to the queue (owner, analyst)
 *   GET  /benches/:benchId/lasers/:laserId/spectra   a laser's analysed captures (any member)
 * The /benches/:benchId route relies on app.ts's requireUser + loadBenchAccess for /benches/:benchId.
 */
import { Router } from 'express';
import {
  CreateAnalysisRequest,
  SpectrumQuery,
  type AnalysisResponse,
  type LaserSpectraResponse,
} from '../../contracts/analyses';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import type { AnalysesService } from './analyses.service';

export interface AnalysesRouterDeps {
  analyses: AnalysesService;
}

export function createAnalysesRouter({ analyses }: AnalysesRouterDeps): Router {
  const router = Router();

  router.get('/analyses/:id', requireUser, async (req, res) => {
    res.json(await analyses.get(currentAuth(res).user.id, routeParam(req, 'id')));
  });

  router.get('/analyses/:id/spectrum', requireUser, async (req, res) => {
    const query = SpectrumQuery.parse(req.query);
    // SpectrumResponse, serialised once per analysis, view and points
    const json = await analyses.spectrumJson(currentAuth(res).user.id, routeParam(req, 'id'), query);
    res.type('application/json').send(json);
  });

  router.get('/analyses/:id/series.csv', requireUser, async (req, res) => {
    const id = routeParam(req, 'id');
    const csv = await analyses.seriesCsv(currentAuth(res).user.id, id);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="spectrum-${id}.csv"`);
    csv.pipe(res);
  });

  router.post('/captures/:id/analyses', requireUser, async (req, res) => {
    const parseSettings = () => CreateAnalysisRequest.parse(req.body ?? {}).settings;
    const analysis = await analyses.create(currentAuth(res).user.id, routeParam(req, 'id'), parseSettings);
    res.status(201).json({ analysis } satisfies AnalysisResponse);
  });

  router.post('/analyses/:id/retry', requireUser, async (req, res) => {
    const analysis = await analyses.retry(currentAuth(res).user.id, routeParam(req, 'id'));
    res.json({ analysis } satisfies AnalysisResponse);
  });

  router.get('/benches/:benchId/lasers/:laserId/spectra', requireUser, async (req, res) => {
    const reply = await analyses.laserSpectra(benchAccessOf(res), routeParam(req, 'laserId'));
    res.json(reply satisfies LaserSpectraResponse);
  });

  return router;
}
