/**
 * Share-link routes (signed in), mounted at the API root (app.ts):
 *   POST   /analyses/:id/share-links         { expiresAt? } -> 201 { id, url } (owner, analyst)
 *   POST   /overlays/:id/share-links         { expiresAt? } -> 201 { id, url } (owner, analyst)
 *   DELETE /share-links/:id                  -> 204 (owner, analyst)
 *   GET    /benches/:benchId/share-links     -> the bench's links, never tokens (owner, analyst)
 * The public side is GET /shared/:token (shared.router.ts).
 */
import type { Request } from 'express';
import { Router } from 'express';
import { CreateShareLinkRequest, type CreateShareLinkResponse, type ShareLinkListResponse } from '../../contracts/share-links';
import { routeParam } from '../../lib/route-param';
import { benchAccessOf } from '../../middleware/bench-access';
import { currentAuth, requireUser } from '../../middleware/session';
import type { ShareLinksService } from './share-links.service';

export interface ShareLinksRouterDeps {
  shareLinks: ShareLinksService;
  /** the site's public origin (PHASELOOM_PUBLIC_URL); without it, the request's own */
  publicUrl?: string;
}

export function createShareLinksRouter({ shareLinks, publicUrl }: ShareLinksRouterDeps): Router {
  const router = Router();
  const baseOf = (req: Request) => publicUrl ?? `${req.protocol}://${req.get('host') ?? 'localhost'}`;
  const parseBody = (req: Request) => () => CreateShareLinkRequest.parse(req.body ?? {});

  router.post('/analyses/:id/share-links', requireUser, async (req, res) => {
    const reply = await shareLinks.createForAnalysis(currentAuth(res).user.id, routeParam(req, 'id'), parseBody(req), baseOf(req));
    res.status(201).json(reply satisfies CreateShareLinkResponse);
  });

  router.post('/overlays/:id/share-links', requireUser, async (req, res) => {
    const reply = await shareLinks.createForOverlay(currentAuth(res).user.id, routeParam(req, 'id'), parseBody(req), baseOf(req));
    res.status(201).json(reply satisfies CreateShareLinkResponse);
  });

  router.delete('/share-links/:id', requireUser, async (req, res) => {
    await shareLinks.revoke(currentAuth(res).user.id, routeParam(req, 'id'));
    res.status(204).end();
  });

  router.get('/benches/:benchId/share-links', requireUser, async (_req, res) => {
    res.json({ shareLinks: await shareLinks.list(benchAccessOf(res)) } satisfies ShareLinkListResponse);
  });

  return router;
}
