/**
 * GET /version → { name, version }: the product version from package.json, printed on reports so a
 * reader knows which build produced the figures. Public (it says nothing about any bench).
 */
import { readFileSync } from 'node:fs';
import { Router } from 'express';
import { VersionResponse } from '../../contracts/reports';

/** Read once: the package.json beside server/ (the repository root). */
export function productVersion(): VersionResponse {
  const text = readFileSync(new URL('../../../package.json', import.meta.url), 'utf8');
  const { name, version } = VersionResponse.parse(JSON.parse(text));
  return { name, version };
}

export function createVersionRouter(): Router {
  const router = Router();
  const reply = productVersion();
  router.get('/version', (_req, res) => {
    res.json(reply satisfies VersionResponse);
  });
  return router;
}
