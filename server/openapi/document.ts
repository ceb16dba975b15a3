/**
 * The OpenAPI 3.1 document of the API, made from the route registry (routes.ts) and the zod contracts
 * with @asteasolutions/zod-to-openapi. Public routes carry no security requirement; every other route
 * takes the session cookie or a personal API token (`Authorization: Bearer`).
 */
import { OpenAPIRegistry, OpenApiGeneratorV31, type RouteConfig } from '@asteasolutions/zod-to-openapi';
import { z } from 'zod';
import { Id, ErrorResponse } from '../contracts/common';
import { describeRoute, successStatus, type RouteSpec } from './route-spec';
import { ROUTES } from './routes';

/** The one error shape, as the component "Error" (named once per process: zod's registry keeps ids). */
const ErrorSchema = ErrorResponse.meta({ id: 'Error' });

export const SESSION_COOKIE_SCHEME = 'sessionCookie';
export const BEARER_SCHEME = 'bearerToken';

const ERROR_TEXT: Record<number, string> = {
  400: 'the request broke its schema (`validation_failed`, with details per field) or the input cannot be used',
  401: 'no valid session or API token (`unauthenticated`); an unknown, revoked or expired token says which',
  403: 'your role does not allow this (`forbidden`), or a cookie request from another site (`bad_origin`)',
  404: 'no such thing, or not visible to you (members of other benches get 404 too)',
  409: 'conflicts with what exists (`conflict`)',
  410: 'the link was revoked or has expired',
  413: 'the upload is larger than the limit (`payload_too_large`)',
  429: 'too many attempts (`rate_limited`)',
};

/** Path parameters are ids except where the name says otherwise (a share link's token). */
function paramSchema(name: string): z.ZodType {
  return name === 'token' ? z.string().min(1) : Id;
}

function errorStatuses(spec: RouteSpec, params: string[]): number[] {
  const out = new Set<number>(spec.errors ?? []);
  if (spec.body || spec.query || spec.multipart || params.length > 0) out.add(400);
  if (!spec.public) {
    out.add(401);
    if (spec.who !== 'signed in' && spec.who !== 'any member') out.add(403);
  }
  if (params.length > 0) out.add(404);
  return [...out].sort((a, b) => a - b);
}

function routeConfig(spec: RouteSpec, errorSchema: z.ZodType): RouteConfig {
  const { method, openApiPath, params } = describeRoute(spec.route);
  const request: NonNullable<RouteConfig['request']> = {};
  if (params.length > 0) request.params = z.object(Object.fromEntries(params.map((p) => [p, paramSchema(p)])));
  if (spec.query) request.query = spec.query;
  if (spec.body) request.body = { required: true, content: { 'application/json': { schema: spec.body } } };
  if (spec.multipart) {
    const file = z.object({ file: z.string().meta({ format: 'binary', description: 'the file, in the part named "file"' }) });
    request.body = {
      required: true,
      description: 'multipart/form-data: the file plus text fields (numbers and JSON sent as text)',
      content: { 'multipart/form-data': { schema: file.and(spec.multipart) } },
    };
  }

  const status = successStatus(spec, method);
  const responses: RouteConfig['responses'] = {};
  if (spec.replyType) {
    responses[status] = { description: spec.what, content: { [spec.replyType]: { schema: z.string() } } };
  } else if (spec.reply) {
    responses[status] = { description: spec.what, content: { 'application/json': { schema: spec.reply } } };
  } else {
    responses[status] = { description: `${spec.what}: done, no content` };
  }
  for (const code of errorStatuses(spec, params)) {
    responses[code] = { description: ERROR_TEXT[code] ?? 'error', content: { 'application/json': { schema: errorSchema } } };
  }

  return {
    method,
    path: openApiPath,
    summary: spec.what,
    description: `Who: ${spec.who}.`,
    tags: [openApiPath.split('/')[2] ?? 'api'],
    security: spec.public ? [] : [{ [SESSION_COOKIE_SCHEME]: [] }, { [BEARER_SCHEME]: [] }],
    request: Object.keys(request).length > 0 ? request : undefined,
    responses,
  };
}

export type OpenApiDocument = ReturnType<OpenApiGeneratorV31['generateDocument']>;

export function buildOpenApiDocument(routes: RouteSpec[] = ROUTES, version = '1.0.0'): OpenApiDocument {
  const registry = new OpenAPIRegistry();
  registry.registerComponent('securitySchemes', SESSION_COOKIE_SCHEME, {
    type: 'apiKey',
    in: 'cookie',
    name: 'phaseloom_session',
    description: 'The session cookie set by POST /api/auth/sign-in (browsers; state-changing requests need our Origin).',
  });
  registry.registerComponent('securitySchemes', BEARER_SCHEME, {
    type: 'http',
    scheme: 'bearer',
    description: 'A personal API token made on the account page: `Authorization: Bearer plm_…`. Acts as its owner.',
  });
  for (const spec of routes) registry.registerPath(routeConfig(spec, ErrorSchema));
  return new OpenApiGeneratorV31(registry.definitions).generateDocument({
    openapi: '3.1.0',
    info: {
      title: 'Phaseloom API',
      version,
      description:
        'Laser frequency-noise captures, spectra and figures shared on benches. JSON in and out (uploads are ' +
        'multipart); errors are `{ "error": { "code", "message", "details"? } }`.',
    },
    servers: [{ url: '/' }],
  });
}
