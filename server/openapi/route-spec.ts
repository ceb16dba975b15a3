/**
 * The shape of one entry of the OpenAPI route registry (routes.ts), and `describeRoute` which turns
 * "GET /api/benches/:benchId" into its method, OpenAPI path and path parameters.
 */
import type { z } from 'zod';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteSpec {
  /** Method and Express path, e.g. "GET /api/benches/:benchId/lasers/:laserId". */
  route: string;
  /** One line: what it does. */
  what: string;
  /** Who may call it, for the README table: "anyone", "signed in", "any member", "owner, analyst"… */
  who: string;
  /** No sign-in needed (no security requirement in the document). */
  public?: true;
  query?: z.ZodObject;
  /** A JSON request body. */
  body?: z.ZodType;
  /** A multipart/form-data body: these text fields plus one file in the part named `file`. */
  multipart?: z.ZodObject;
  /** The JSON reply; without it (and without `replyType`) the route answers 204 No Content. */
  reply?: z.ZodType;
  /** A non-JSON reply, e.g. "text/csv" (the body is described as text). */
  replyType?: string;
  /** Success status; default 201 for a POST with a reply, 200 for other replies, 204 without. */
  status?: number;
  /** Error statuses beyond the ones every route of its kind can give (400, 401, 403, 404). */
  errors?: number[];
}

export interface DescribedRoute {
  method: HttpMethod;
  /** Express syntax: /api/benches/:benchId */
  expressPath: string;
  /** OpenAPI syntax: /api/benches/{benchId} */
  openApiPath: string;
  params: string[];
}

const METHODS = new Set<HttpMethod>(['get', 'post', 'put', 'patch', 'delete']);

export function describeRoute(route: string): DescribedRoute {
  const [verb, expressPath, ...rest] = route.trim().split(/\s+/);
  const method = verb?.toLowerCase() as HttpMethod;
  if (!METHODS.has(method) || !expressPath?.startsWith('/') || rest.length > 0) {
    throw new Error(`route "${route}" must read "<METHOD> /path" (METHOD one of GET POST PUT PATCH DELETE)`);
  }
  const params = [...expressPath.matchAll(/:([A-Za-z_][A-Za-z0-9_]*)/g)].map((m) => m[1]);
  return { method, expressPath, openApiPath: expressPath.replace(/:([A-Za-z_][A-Za-z0-9_]*)/g, '{$1}'), params };
}

export function successStatus(spec: RouteSpec, method: HttpMethod): number {
  if (spec.status) return spec.status;
  if (!spec.reply && !spec.replyType) return 204;
  return method === 'post' ? 201 : 200;
}
