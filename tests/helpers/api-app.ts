/**
 * Helpers for API tests: an app on the real test database, agents that send our Origin, and
 * shortcuts to make accounts, benches and members.
 */
import { randomBytes } from 'node:crypto';
import type { Express, Router } from 'express';
import type { Knex } from 'knex';
import { pino, type Logger } from 'pino';
import request from 'supertest';
import { createApp } from '../../server/app';
import { loadEnv, type Env } from '../../server/config/env';
import type { BenchRole } from '../../server/contracts/benches';
import { createDb } from '../../server/db/knex';
import type { AuthRateLimits } from '../../server/modules/auth/auth-rate-limits';
import { createServices, type Services } from '../../server/services';

export const PUBLIC_URL = 'http://phaseloom.test';
export const ORIGIN = PUBLIC_URL;
export const TEST_PASSWORD = 'correct horse battery staple';

let sharedDb: Knex | undefined;

/** One Knex pool per test file (close it with closeTestDb in afterAll). */
export function testDb(): Knex {
  sharedDb ??= createDb(loadEnv());
  return sharedDb;
}

export async function closeTestDb(): Promise<void> {
  await sharedDb?.destroy();
  sharedDb = undefined;
}

export interface TestAppOptions {
  env?: Partial<Env>;
  rateLimits?: AuthRateLimits;
  logger?: Logger;
  extraApiRoutes?: (api: Router) => void;
}

export interface TestApp {
  app: Express;
  db: Knex;
  services: Services;
}

/** Rate limits high enough that no test trips them unless it means to. */
export const GENEROUS_LIMITS: AuthRateLimits = { windowMs: 60_000, signIn: { limit: 1000 }, signUp: { limit: 1000 } };

export function makeTestApp(options: TestAppOptions = {}): TestApp {
  const db = testDb();
  const env: Env = { ...loadEnv(), PHASELOOM_PUBLIC_URL: PUBLIC_URL, ...options.env };
  const services = createServices(db);
  const app = createApp({
    db,
    env,
    logger: options.logger ?? pino({ level: 'silent' }),
    services,
    rateLimits: options.rateLimits ?? GENEROUS_LIMITS,
    extraApiRoutes: options.extraApiRoutes,
  });
  return { app, db, services };
}

/** A cookie-keeping agent that sends our Origin on every request, as the browser would. */
export function agent(app: Express) {
  return request.agent(app).set('Origin', ORIGIN);
}
export type Agent = ReturnType<typeof agent>;

/** A unique e-mail for a test account. */
export function uniqueEmail(who = 'user'): string {
  return `${who}-${randomBytes(6).toString('hex')}@example.org`;
}

export interface SignedIn {
  agent: Agent;
  user: { id: string; email: string; name: string; createdAt: string };
  /** "phaseloom_session=…", for requests made without the agent. */
  cookie: string;
}

/** Signs up a new account through the API and returns its signed-in agent. */
export async function signUp(app: Express, who = 'user'): Promise<SignedIn> {
  const a = agent(app);
  const res = await a.post('/api/auth/sign-up').send({ email: uniqueEmail(who), name: who, password: TEST_PASSWORD });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const setCookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const cookie = setCookie.find((c) => c.startsWith('phaseloom_session='))?.split(';')[0];
  if (!cookie) throw new Error('sign-up set no session cookie');
  return { agent: a, user: res.body.user, cookie };
}

/** Creates a bench owned by `owner` and returns its id. */
export async function createBench(owner: SignedIn, name = 'Test bench'): Promise<string> {
  const res = await owner.agent.post('/api/benches').send({ name });
  if (res.status !== 201) throw new Error(`bench creation failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.bench.id;
}

/** Adds `member` to the bench with `role` (as the owner). */
export async function addMember(owner: SignedIn, benchId: string, member: SignedIn, role: BenchRole): Promise<void> {
  const res = await owner.agent.post(`/api/benches/${benchId}/members`).send({ email: member.user.email, role });
  if (res.status !== 201) throw new Error(`adding a member failed: ${res.status} ${JSON.stringify(res.body)}`);
}

/** Asserts the JSON error shape and returns the error object. */
export function errorOf(res: request.Response): { code: string; message: string; details?: { path: string; message: string }[] } {
  const body = res.body as { error?: { code?: unknown; message?: unknown } };
  if (!body?.error || typeof body.error.code !== 'string' || typeof body.error.message !== 'string') {
    throw new Error(`not the JSON error shape: ${res.status} ${res.text}`);
  }
  return res.body.error;
}
