/** GET /api/openapi.json: the OpenAPI 3.1 document, built once on the first request. Public. */
import { Router } from 'express';
import { productVersion } from '../modules/reports/version.router';
import { buildOpenApiDocument } from './document';

export function openApiRouter(): Router {
  const router = Router();
  let json: string | undefined;
  router.get('/openapi.json', (_req, res) => {
    json ??= JSON.stringify(buildOpenApiDocument(undefined, productVersion().version));
    res.type('application/json').send(json);
  });
  return router;
}
