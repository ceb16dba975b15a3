/**
 * GET /api/openapi.json: an OpenAPI 3.1 document that covers exactly the routes the app answers
 * (read from the app's own router stack), structurally sound, with security on every route that
 * needs a sign-in; and the README's API table lists every route.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';
import { BEARER_SCHEME, SESSION_COOKIE_SCHEME, buildOpenApiDocument } from '../../server/openapi/document';
import { mountedRoutes } from '../../server/openapi/express-routes';
import { describeRoute } from '../../server/openapi/route-spec';
import { ROUTES } from '../../server/openapi/routes';
import { routeTableRow } from '../../server/openapi/routes-table';
import { closeTestDb, makeTestApp } from '../helpers/api-app';

const { app } = makeTestApp();
const key = (method: string, path: string) => `${method.toUpperCase()} ${path}`;

type Operation = {
  responses?: Record<string, unknown>;
  security?: Record<string, string[]>[];
  parameters?: { in: string; name: string; required?: boolean }[];
};

afterAll(async () => {
  await closeTestDb();
});

describe('the route registry', () => {
  it('lists every /api route the app answers, and only those', () => {
    const answered = mountedRoutes(app)
      .filter((r) => r.path.startsWith('/api/'))
      .map((r) => key(r.method, r.path));
    const registered = ROUTES.map((s) => describeRoute(s.route)).map((d) => key(d.method, d.expressPath));
    const missing = answered.filter((r) => !registered.includes(r));
    const extra = registered.filter((r) => !answered.includes(r));
    expect(missing, 'routes the app answers but server/openapi/routes.ts lacks').toEqual([]);
    expect(extra, 'routes in server/openapi/routes.ts the app does not answer').toEqual([]);
  });

  it('has each route once', () => {
    const keys = ROUTES.map((s) => describeRoute(s.route)).map((d) => key(d.method, d.expressPath));
    expect(keys.filter((k, i) => keys.indexOf(k) !== i)).toEqual([]);
  });

  it('is read from the real router stack (the walk finds nested routers and their mount paths)', () => {
    const answered = mountedRoutes(app).map((r) => key(r.method, r.path));
    expect(answered).toContain('PATCH /api/benches/:benchId/members/:userId');
    expect(answered).toContain('DELETE /api/me/tokens/:id');
    expect(answered).toContain('GET /api/openapi.json');
  });
});

describe('GET /api/openapi.json', () => {
  it('answers the document without a sign-in', async () => {
    const res = await request(app).get('/api/openapi.json');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^application\/json/);
    expect(res.body.openapi).toMatch(/^3\.1\.\d+$/);
    expect(Object.keys(res.body.paths)).toContain('/api/me/tokens/{id}');
  });

  it('is OpenAPI 3.1 with info, and every operation of every path has responses including a success', () => {
    const doc = buildOpenApiDocument();
    expect(doc.openapi).toMatch(/^3\.1\.\d+$/);
    expect(doc.info.title).toBeTruthy();
    expect(doc.info.version).toBeTruthy();
    const paths = doc.paths ?? {};
    expect(Object.keys(paths).length).toBeGreaterThan(0);
    for (const [p, item] of Object.entries(paths)) {
      expect(p.startsWith('/api/'), p).toBe(true);
      const ops = Object.entries(item as Record<string, Operation>).filter(([m]) => ['get', 'post', 'put', 'patch', 'delete'].includes(m));
      expect(ops.length, p).toBeGreaterThan(0);
      for (const [m, op] of ops) {
        const codes = Object.keys(op.responses ?? {});
        expect(codes.length, `${m} ${p}`).toBeGreaterThan(0);
        expect(codes.some((c) => /^2\d\d$/.test(c)), `${m} ${p} has a 2xx`).toBe(true);
        // every {param} of the path is a required path parameter
        for (const name of [...p.matchAll(/\{(\w+)\}/g)].map((x) => x[1])) {
          const param = op.parameters?.find((q) => q.in === 'path' && q.name === name);
          expect(param?.required, `${m} ${p} declares {${name}}`).toBe(true);
        }
      }
    }
  });

  it('covers every registered route under its OpenAPI path', () => {
    const doc = buildOpenApiDocument();
    for (const spec of ROUTES) {
      const { method, openApiPath } = describeRoute(spec.route);
      expect((doc.paths?.[openApiPath] as Record<string, unknown> | undefined)?.[method], spec.route).toBeDefined();
    }
  });

  it('marks public routes without security and the others with cookie or bearer', () => {
    const doc = buildOpenApiDocument();
    const schemes = doc.components?.securitySchemes ?? {};
    expect(schemes[SESSION_COOKIE_SCHEME]).toMatchObject({ type: 'apiKey', in: 'cookie', name: 'phaseloom_session' });
    expect(schemes[BEARER_SCHEME]).toMatchObject({ type: 'http', scheme: 'bearer' });
    for (const spec of ROUTES) {
      const { method, openApiPath } = describeRoute(spec.route);
      const op = (doc.paths?.[openApiPath] as Record<string, Operation>)[method];
      if (spec.public) expect(op.security, spec.route).toEqual([]);
      else expect(op.security, spec.route).toEqual([{ [SESSION_COOKIE_SCHEME]: [] }, { [BEARER_SCHEME]: [] }]);
    }
    const publicOnes = ROUTES.filter((s) => s.public).map((s) => s.route);
    expect(publicOnes).toEqual(expect.arrayContaining(['GET /api/openapi.json', 'POST /api/auth/sign-in', 'GET /api/shared/:token']));
  });

  it('describes the upload as multipart with the file part', () => {
    const doc = buildOpenApiDocument();
    const op = (doc.paths?.['/api/benches/{benchId}/captures'] as Record<string, { requestBody?: { content: Record<string, unknown> } }>).post;
    expect(Object.keys(op.requestBody?.content ?? {})).toEqual(['multipart/form-data']);
    expect(JSON.stringify(op.requestBody)).toContain('"file"');
  });
});

describe('README.md', () => {
  it('lists every route in its API table', () => {
    const readme = readFileSync(path.join(projectRoot, 'README.md'), 'utf8');
    const missing = ROUTES.map(routeTableRow).filter((row) => !readme.includes(row));
    expect(missing, 'print the table with `npx tsx server/openapi/routes-table.ts`').toEqual([]);
  });
});
