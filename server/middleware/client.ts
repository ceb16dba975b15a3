/**
 * Serves the built client (dist/client): hashed assets with a long cache, and index.html for every
 * other GET that is not under /api (the client's router takes it from there). When the client has
 * not been built, GETs answer 503 with a line that says how to build it.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router, type NextFunction, type Request, type Response } from 'express';
import { notFound } from '../errors';

export function clientRoutes(clientDir: string): Router {
  const router = Router();
  const indexHtml = path.join(clientDir, 'index.html');
  if (!existsSync(indexHtml)) {
    router.get('/{*path}', (_req, res) => {
      res
        .status(503)
        .type('text/plain')
        .send('Phaseloom: the client has not been built (dist/client is missing); run `npm run build` or `npm start`.\n');
    });
    return router;
  }
  router.use(
    '/assets',
    express.static(path.join(clientDir, 'assets'), { immutable: true, maxAge: '365d', index: false }),
    (req: Request, _res: Response, next: NextFunction) => next(notFound(`no asset ${req.originalUrl.split('?')[0]}`)),
  );
  router.use(express.static(clientDir, { index: false, maxAge: 0 }));
  router.get('/{*path}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  return router;
}
