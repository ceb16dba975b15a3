/**
 * GET /api/outbox: the e-mail the local mail catcher kept (development and test). With
 * NODE_ENV=production the route does not exist (404), and no mail catcher runs.
 */
import { Router } from 'express';
import { OutboxListQuery, type OutboxListResponse } from '../../contracts/outbox';
import { notFound } from '../../errors';
import { listCaughtMessages } from '../../mail/outbox-store';

export function outboxRouter(options: { enabled: boolean; dir: string }): Router {
  const router = Router();
  router.get('/outbox', async (req, res) => {
    if (!options.enabled) throw notFound('no API route GET /api/outbox');
    const { to } = OutboxListQuery.parse(req.query);
    let messages = await listCaughtMessages(options.dir);
    if (to) messages = messages.filter((m) => m.recipients.some((r) => r.toLowerCase() === to));
    res.json({ messages } satisfies OutboxListResponse);
  });
  return router;
}
