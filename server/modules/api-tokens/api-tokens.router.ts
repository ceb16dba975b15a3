/**
 * /api/me/tokens[/:id]: the signed-in person's personal API tokens. Mounted behind requireUser (app.ts).
 *   GET    /me/tokens       list (session or token)
 *   POST   /me/tokens       make one; only from a signed-in session, so a leaked token cannot mint more
 *   DELETE /me/tokens/:id   revoke (session, or any of your tokens — a script may retire itself)
 */
import { Router } from 'express';
import {
  CreateApiTokenRequest,
  type ApiTokenListResponse,
  type CreatedApiTokenResponse,
} from '../../contracts/api-tokens';
import { forbidden } from '../../errors';
import { routeParam } from '../../lib/route-param';
import { currentAuth } from '../../middleware/session';
import type { ApiTokensService } from './api-tokens.service';

export function apiTokensRouter(tokens: ApiTokensService): Router {
  const router = Router();

  router.get('/', async (_req, res) => {
    res.json({ tokens: await tokens.list(currentAuth(res).user.id) } satisfies ApiTokenListResponse);
  });

  router.post('/', async (req, res) => {
    const caller = currentAuth(res);
    if (!caller.session) throw forbidden('API tokens are made on the account page while signed in, not with another token');
    const input = CreateApiTokenRequest.parse(req.body);
    const created = await tokens.create(caller.user.id, input);
    res.status(201).json(created satisfies CreatedApiTokenResponse);
  });

  router.delete('/:id', async (req, res) => {
    await tokens.revoke(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  return router;
}
