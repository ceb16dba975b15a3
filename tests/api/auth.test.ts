import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { UserResponse } from '../../server/contracts/auth';
import {
  agent,
  closeTestDb,
  errorOf,
  makeTestApp,
  ORIGIN,
  signUp,
  TEST_PASSWORD,
  uniqueEmail,
} from '../helpers/api-app';

afterAll(closeTestDb);

function sessionCookie(res: request.Response): string {
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const cookie = cookies.find((c) => c.startsWith('phaseloom_session='));
  if (!cookie) throw new Error(`no session cookie in ${JSON.stringify(cookies)}`);
  return cookie;
}

describe('POST /api/auth/sign-up', () => {
  const { app, db } = makeTestApp();

  it('returns 201 {user} and a session cookie that is HttpOnly, SameSite=Lax, Path=/', async () => {
    const email = uniqueEmail('mira');
    const res = await agent(app).post('/api/auth/sign-up').send({ email, name: 'Mira', password: TEST_PASSWORD });
    expect(res.status).toBe(201);
    const { user } = UserResponse.parse(res.body);
    expect(user).toMatchObject({ email, name: 'Mira' });
    const cookie = sessionCookie(res);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\/(;|$)/);
    expect(cookie).not.toMatch(/;\s*Secure/i); // plain http
  });

  it('marks the cookie Secure when the request came over https (X-Forwarded-Proto with trust proxy)', async () => {
    const proxied = makeTestApp({ env: { PHASELOOM_TRUST_PROXY: 'loopback' } });
    const res = await request(proxied.app)
      .post('/api/auth/sign-up')
      .set('Origin', ORIGIN)
      .set('X-Forwarded-Proto', 'https')
      .send({ email: uniqueEmail(), name: 'Behind a proxy', password: TEST_PASSWORD });
    expect(res.status).toBe(201);
    expect(sessionCookie(res)).toMatch(/;\s*Secure/i);
  });

  it('lower-cases and trims the e-mail', async () => {
    const email = uniqueEmail('Tomas');
    const res = await agent(app)
      .post('/api/auth/sign-up')
      .send({ email: `  ${email.toUpperCase()} `, name: 'Tomas', password: TEST_PASSWORD });
    expect(res.status).toBe(201);
    expect(res.body.user.email).toBe(email.toLowerCase());
  });

  it('stores an argon2id hash, never the password', async () => {
    const email = uniqueEmail();
    await agent(app).post('/api/auth/sign-up').send({ email, name: 'Hash check', password: TEST_PASSWORD });
    const row = await db('users').where({ email }).first('password_hash');
    expect(row.password_hash).toMatch(/^\$argon2id\$v=19\$/);
    expect(row.password_hash).not.toContain(TEST_PASSWORD);
  });

  it('refuses a password shorter than 12 characters with 400 validation_failed naming the field', async () => {
    const res = await agent(app).post('/api/auth/sign-up').send({ email: uniqueEmail(), name: 'Short', password: 'elevenchars' });
    expect(res.status).toBe(400);
    const error = errorOf(res);
    expect(error.code).toBe('validation_failed');
    expect(error.message).toContain('password');
    expect(error.details).toEqual([{ path: 'password', message: 'must be at least 12 characters' }]);
  });

  it('names every bad field: e-mail, name and password', async () => {
    const res = await agent(app).post('/api/auth/sign-up').send({ email: 'not-an-email', name: '   ' });
    expect(res.status).toBe(400);
    const paths = errorOf(res).details!.map((d) => d.path).sort();
    expect(paths).toEqual(['email', 'name', 'password']);
  });

  it('answers 409 for an e-mail that already has an account', async () => {
    const email = uniqueEmail();
    await agent(app).post('/api/auth/sign-up').send({ email, name: 'First', password: TEST_PASSWORD });
    const res = await agent(app).post('/api/auth/sign-up').send({ email, name: 'Second', password: TEST_PASSWORD });
    expect(res.status).toBe(409);
    expect(errorOf(res)).toMatchObject({ code: 'conflict', message: expect.stringContaining('already exists') });
  });

  it('answers 400 bad_json for a body that is not JSON', async () => {
    const res = await agent(app).post('/api/auth/sign-up').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(errorOf(res).code).toBe('bad_json');
  });
});

describe('POST /api/auth/sign-in, GET /api/me, POST /api/auth/sign-out', () => {
  const { app } = makeTestApp();

  it('signs in with the right password: 200 {user}, cookie, then GET /api/me returns the user', async () => {
    const { user } = await signUp(app, 'ines');
    const a = agent(app);
    const res = await a.post('/api/auth/sign-in').send({ email: user.email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual(user);
    expect(sessionCookie(res)).toMatch(/HttpOnly/i);
    const me = await a.get('/api/me');
    expect(me.status).toBe(200);
    expect(UserResponse.parse(me.body).user).toEqual(user);
  });

  it('answers a wrong password and an unknown e-mail with the same 401 and message', async () => {
    const { user } = await signUp(app);
    const wrongPassword = await agent(app).post('/api/auth/sign-in').send({ email: user.email, password: 'not the password at all' });
    const unknownEmail = await agent(app).post('/api/auth/sign-in').send({ email: uniqueEmail('nobody'), password: TEST_PASSWORD });
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(errorOf(wrongPassword)).toEqual(errorOf(unknownEmail));
    expect(errorOf(wrongPassword)).toEqual({ code: 'invalid_credentials', message: 'wrong e-mail or password' });
    expect(wrongPassword.headers['set-cookie']).toBeUndefined();
  });

  it('GET /api/me without a session answers 401 unauthenticated', async () => {
    const res = await request(app).get('/api/me');
    expect(res.status).toBe(401);
    expect(errorOf(res).code).toBe('unauthenticated');
  });

  it('GET /api/me with an unknown session cookie answers 401 and clears the cookie', async () => {
    const res = await request(app).get('/api/me').set('Cookie', 'phaseloom_session=abcdefghijklmnopqrstuvwxyz234567');
    expect(res.status).toBe(401);
    expect(sessionCookie(res)).toMatch(/^phaseloom_session=;/);
  });

  it('sign-out answers 204, ends the session on the server and clears the cookie', async () => {
    const { agent: a, cookie: cookieHeader } = await signUp(app);
    expect((await a.get('/api/me')).status).toBe(200);
    const out = await a.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(sessionCookie(out)).toMatch(/^phaseloom_session=;/);
    // the old cookie no longer works, even when replayed
    const replay = await request(app).get('/api/me').set('Cookie', cookieHeader);
    expect(replay.status).toBe(401);
  });
});

describe('sign-in and sign-up rate limits', () => {
  it('answers 429 rate_limited after the sign-in limit for one address and e-mail', async () => {
    const { app } = makeTestApp({ rateLimits: { windowMs: 60_000, signIn: { limit: 3 }, signUp: { limit: 100 } } });
    const { user } = await signUp(app);
    const attempt = () => agent(app).post('/api/auth/sign-in').send({ email: user.email, password: 'wrong password, again' });
    for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
    const limited = await attempt();
    expect(limited.status).toBe(429);
    expect(errorOf(limited)).toEqual({
      code: 'rate_limited',
      message: 'too many sign-in attempts for this e-mail; wait 1 minute and try again',
    });
    // even the right password waits until the window has passed
    const right = await agent(app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(right.status).toBe(429);
    // another e-mail from the same address is not affected
    const other = await signUp(app);
    const ok = await agent(app).post('/api/auth/sign-in').send({ email: other.user.email, password: TEST_PASSWORD });
    expect(ok.status).toBe(200);
  });

  it('does not count successful sign-ins', async () => {
    const { app } = makeTestApp({ rateLimits: { windowMs: 60_000, signIn: { limit: 2 }, signUp: { limit: 100 } } });
    const { user } = await signUp(app);
    for (let i = 0; i < 4; i++) {
      const res = await agent(app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
      expect(res.status).toBe(200);
    }
  });

  it('answers 429 rate_limited after the sign-up limit for one address', async () => {
    const { app } = makeTestApp({ rateLimits: { windowMs: 60_000, signIn: { limit: 100 }, signUp: { limit: 2 } } });
    await signUp(app);
    await signUp(app);
    const res = await agent(app).post('/api/auth/sign-up').send({ email: uniqueEmail(), name: 'Third', password: TEST_PASSWORD });
    expect(res.status).toBe(429);
    expect(errorOf(res).code).toBe('rate_limited');
    expect(errorOf(res).message).toContain('too many sign-ups');
  });
});

describe('Origin check on state-changing requests', () => {
  const { app } = makeTestApp();

  it('refuses a cookie-authenticated POST from another site with 403 bad_origin and writes nothing', async () => {
    const owner = await signUp(app);
    const before = await owner.agent.get('/api/benches');
    const res = await owner.agent.post('/api/benches').set('Origin', 'https://evil.example').send({ name: 'Planted' });
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('bad_origin');
    const after = await owner.agent.get('/api/benches');
    expect(after.body.benches).toEqual(before.body.benches);
  });

  it('refuses a cookie-authenticated POST without Origin or Referer', async () => {
    const { cookie } = await signUp(app);
    const res = await request(app).post('/api/auth/sign-out').set('Cookie', cookie);
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('bad_origin');
  });

  it('accepts a Referer from our own site when there is no Origin', async () => {
    const { cookie } = await signUp(app);
    const res = await request(app)
      .post('/api/benches')
      .set('Cookie', cookie)
      .set('Referer', `${ORIGIN}/benches`)
      .send({ name: 'Via referer' });
    expect(res.status).toBe(201);
  });

  it('accepts an Origin that matches the Host header', async () => {
    const res = await request(app)
      .post('/api/auth/sign-up')
      .set('Host', 'lab.internal:8080')
      .set('Origin', 'http://lab.internal:8080')
      .send({ email: uniqueEmail(), name: 'Same host', password: TEST_PASSWORD });
    expect(res.status).toBe(201);
  });

  it('refuses a sign-in posted from another site (login CSRF)', async () => {
    const res = await request(app)
      .post('/api/auth/sign-in')
      .set('Origin', 'http://phaseloom.test.evil.example')
      .send({ email: uniqueEmail(), password: TEST_PASSWORD });
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('bad_origin');
  });

  it('lets GET requests through without Origin', async () => {
    const { cookie } = await signUp(app);
    expect((await request(app).get('/api/me').set('Cookie', cookie)).status).toBe(200);
  });
});

describe('security headers (helmet)', () => {
  const { app } = makeTestApp();

  it('sends a CSP that allows our own scripts and styles only, plus nosniff and frame protection', async () => {
    const res = await request(app).get('/api/me');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(csp).toContain("style-src 'self'");
    expect(csp).toMatch(/img-src[^;]*data:/);
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['cache-control']).toBe('no-store');
  });
});
