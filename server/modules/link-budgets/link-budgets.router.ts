/**
 * Link-budget routes, mounted at the API root (app.ts):
 *   POST   /link-budgets/evaluate             any signed-in user (analysis ids through bench membership)
 *   GET    /benches/:benchId/link-budgets     any member
 *   POST   /benches/:benchId/link-budgets     owner, analyst (role checked before the body)
 *   GET    /link-budgets/:id                  any member of its bench
 *   DELETE /link-budgets/:id                  owner, or the analyst who saved it
 * The /benches/:benchId routes rely on app.ts's requireUser + loadBenchAccess for /benches/:benchId.
 */
import { Router } from 'express';
import {
  EvaluateLinkBudgetRequest,
  SaveLinkBudgetRequest,
  type LinkBudgetEvaluation,
  type LinkBudgetListResponse,
  type LinkBudgetResponse,
} from '../../contracts/link-budgets';
import { routeParam } from '../../lib/route-param';
import { allow, benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import { assertCaptureAction } from '../captures/capture-policy';
import type { LinkBudgetsService } from './link-budgets.service';

export function createLinkBudgetsRouter(budgets: LinkBudgetsService): Router {
  const router = Router();

  router.post('/link-budgets/evaluate', requireUser, async (req, res) => {
    const input = EvaluateLinkBudgetRequest.parse(req.body);
    res.json((await budgets.evaluate(currentAuth(res).user.id, input)) satisfies LinkBudgetEvaluation);
  });

  router.get('/benches/:benchId/link-budgets', allow('bench.read'), async (_req, res) => {
    res.json({ linkBudgets: await budgets.list(benchAccessOf(res)) } satisfies LinkBudgetListResponse);
  });

  router.post(
    '/benches/:benchId/link-budgets',
    (_req, res, next) => {
      assertCaptureAction(benchAccessOf(res), 'captures.write');
      next();
    },
    async (req, res) => {
      const body = SaveLinkBudgetRequest.parse(req.body);
      const linkBudget = await budgets.save(benchAccessOf(res), body.name, body.input);
      res.status(201).json({ linkBudget } satisfies LinkBudgetResponse);
    },
  );

  router.get('/link-budgets/:id', requireUser, async (req, res) => {
    res.json({ linkBudget: await budgets.get(currentAuth(res).user.id, routeParam(req, 'id')) } satisfies LinkBudgetResponse);
  });

  router.delete('/link-budgets/:id', requireUser, async (req, res) => {
    await budgets.remove(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
