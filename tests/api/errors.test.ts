import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { AnalysisInputError } from '../../analysis/errors';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/config/env';
import { ErrorResponse } from '../../server/contracts/common';
import { AppError } from '../../server/errors';
import { closeTestDb, errorOf, makeTestApp, ORIGIN, testDb } from '../helpers/api-app';

afterAll(closeTestDb);

describe('the JSON error shape', () => {
  const logged: string[] = [];
  const logger = pino({ level: 'error' }, { write: (line: string) => void logged.push(line) });
  const { app } = makeTestApp({
    logger,
    extraApiRoutes: (api) => {
      api.get('/test/boom', () => {
        throw new Error('database password is hunter2 at /srv/secret/path.ts:12');
      });
      api.get('/test/async-boom', async () => {
        await Promise.resolve();
        throw new TypeError('undefined is not a function');
      });
      api.get('/test/analysis', () => {
        throw new AnalysisInputError('sample rate must be positive', 'header field fs');
      });
      api.get('/test/app-error', () => {
        throw new AppError(409, 'conflict', 'already there');
      });
    },
  });

  it('answers an unknown /api route with 404 not_found in the JSON shape', async () => {
    const res = await request(app).get('/api/no/such/route?x=1');
    expect(res.status).toBe(404);
    expect(res.type).toBe('application/json');
    expect(ErrorResponse.parse(res.body)).toEqual({ error: { code: 'not_found', message: 'no API route GET /api/no/such/route' } });
  });

  it('answers an unknown /api route with 404 for other methods too', async () => {
    const res = await request(app).delete('/api/nothing-here').set('Origin', ORIGIN);
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
  });

  it('answers a programmer error with 500 internal: no stack, no inner message; logs it with pino', async () => {
    logged.length = 0;
    const res = await request(app).get('/api/test/boom');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({
      error: { code: 'internal', message: 'something went wrong on the server; the error has been logged' },
    });
    expect(res.text).not.toContain('hunter2');
    expect(res.text).not.toMatch(/\bat \S+:\d+/); // no stack frames
    const entry = logged.map((l) => JSON.parse(l)).find((e) => e.msg === 'unhandled error');
    expect(entry).toBeDefined();
    expect(entry.err.message).toContain('hunter2');
    expect(entry.err.stack).toContain('Error');
    expect(entry.url).toBe('/api/test/boom');
  });

  it('answers a rejected promise in an async handler the same way (500 internal)', async () => {
    const res = await request(app).get('/api/test/async-boom');
    expect(res.status).toBe(500);
    expect(errorOf(res).code).toBe('internal');
  });

  it('maps AnalysisInputError to 400 bad_input with its message', async () => {
    const res = await request(app).get('/api/test/analysis');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'bad_input', message: 'sample rate must be positive (header field fs)' } });
  });

  it('maps AppError to its status and code', async () => {
    const res = await request(app).get('/api/test/app-error');
    expect(res.status).toBe(409);
    expect(res.body).toEqual({ error: { code: 'conflict', message: 'already there' } });
  });

  it('answers a JSON body over 1 MB with 413 payload_too_large', async () => {
    const res = await request(app)
      .post('/api/auth/sign-in')
      .set('Origin', ORIGIN)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.org', password: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expect(errorOf(res).code).toBe('payload_too_large');
  });

  it('answers a missing body with 400 validation_failed', async () => {
    const res = await request(app).post('/api/auth/sign-in').set('Origin', ORIGIN);
    expect(res.status).toBe(400);
    expect(errorOf(res).code).toBe('validation_failed');
  });
});

describe('serving the built client', () => {
  const env = { ...loadEnv(), PHASELOOM_PUBLIC_URL: ORIGIN };
  const logger = pino({ level: 'silent' });
  const dir = mkdtempSync(path.join(tmpdir(), 'phaseloom-client-'));
  mkdirSync(path.join(dir, 'assets'));
  writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Phaseloom test shell</title>');
  writeFileSync(path.join(dir, 'assets', 'main-abc123.js'), 'console.log(1)');
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  const app = createApp({ db: testDb(), env, logger, clientDir: dir });

  it('serves index.html for client routes (SPA fallback)', async () => {
    const res = await request(app).get('/benches/abc/lasers');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/html');
    expect(res.text).toContain('Phaseloom test shell');
    expect(res.headers['content-security-policy']).toContain("script-src 'self'");
  });

  it('serves hashed assets with a long cache', async () => {
    const res = await request(app).get('/assets/main-abc123.js');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toContain('immutable');
  });

  it('answers a missing asset with 404, not index.html', async () => {
    const res = await request(app).get('/assets/missing.js');
    expect(res.status).toBe(404);
  });

  it('keeps /api routes JSON (unknown ones 404) rather than falling back to index.html', async () => {
    const res = await request(app).get('/api/unknown');
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
  });

  it('says that the client is not built when dist/client is missing', async () => {
    const bare = createApp({ db: testDb(), env, logger, clientDir: path.join(dir, 'does-not-exist') });
    const res = await request(bare).get('/');
    expect(res.status).toBe(503);
    expect(res.text).toContain('the client has not been built');
  });
});
