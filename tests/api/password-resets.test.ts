// "Forgot password", read from the real mail catcher: the same answer for any address (no
// enumeration), a single-use link valid one hour, a new password of at least 12 characters, and the
// account's other sessions ended.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { hashLinkToken } from '../../server/mail/link-token';
import { listCaughtMessages } from '../../server/mail/outbox-store';
import { agent, closeTestDb, errorOf, makeTestApp, PUBLIC_URL, signUp, TEST_PASSWORD, uniqueEmail } from '../helpers/api-app';

let catcher: MailCatcher;
let dir: string;
let app: Express;
let db: ReturnType<typeof makeTestApp>['db'];
const NEW_PASSWORD = 'kestrel ecl quiet floor';

async function resetTokenFor(to: string, after = 0): Promise<string> {
  for (let i = 0; i < 100; i++) {
    const ms = (await listCaughtMessages(dir)).filter((x) => x.recipients.includes(to));
    if (ms.length > after) {
      const match = /(\S+)\/reset-password\/([A-Za-z0-9_-]{43})\b/.exec(ms[0].text);
      if (!match) throw new Error(`no reset link in: ${ms[0].text}`);
      expect(match[1]).toBe(PUBLIC_URL);
      return match[2];
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no message to ${to}`);
}

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-outbox-'));
  catcher = await startMailCatcher({ port: 0, dir });
  ({ app, db } = makeTestApp({ env: { PHASELOOM_SMTP_PORT: catcher.port, PHASELOOM_OUTBOX_DIR: dir } }));
});

afterAll(async () => {
  await catcher.close();
  rmSync(dir, { recursive: true, force: true });
  await closeTestDb();
});

describe('POST /api/password-resets', () => {
  it('answers the same for an address with and without an account, and mails only the account', async () => {
    const user = await signUp(app, 'forgetful');
    const nobody = uniqueEmail('nobody');
    const a = await agent(app).post('/api/password-resets').send({ email: user.user.email });
    const b = await agent(app).post('/api/password-resets').send({ email: nobody });
    expect(a.status).toBe(202);
    expect(b.status).toBe(202);
    expect(a.body).toEqual(b.body);
    const token = await resetTokenFor(user.user.email);
    const row = await db('password_resets').where({ token_hash: hashLinkToken(token) }).first();
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBe(3600 * 1000);
    await new Promise((r) => setTimeout(r, 300));
    expect((await listCaughtMessages(dir)).some((m) => m.recipients.includes(nobody))).toBe(false);
  });

  it('refuses a malformed address (400)', async () => {
    expect((await agent(app).post('/api/password-resets').send({ email: 'nope' })).status).toBe(400);
  });
});

describe('POST /api/password-resets/check and /confirm', () => {
  it('sets the new password once, ends every other session and retires other links', async () => {
    const user = await signUp(app, 'resetter');
    const otherDevice = agent(app);
    expect((await otherDevice.post('/api/auth/sign-in').send({ email: user.user.email, password: TEST_PASSWORD })).status).toBe(200);
    await agent(app).post('/api/password-resets').send({ email: user.user.email });
    const first = await resetTokenFor(user.user.email);
    await agent(app).post('/api/password-resets').send({ email: user.user.email });
    const second = await resetTokenFor(user.user.email, 1);
    expect(second).not.toBe(first);

    const check = await agent(app).post('/api/password-resets/check').send({ token: second });
    expect(check.status).toBe(200);
    expect(check.body.email).toBe(user.user.email);

    const short = await agent(app).post('/api/password-resets/confirm').send({ token: second, password: 'short' });
    expect(short.status).toBe(400);
    expect(errorOf(short).details?.[0].path).toBe('password');

    const ok = await agent(app).post('/api/password-resets/confirm').send({ token: second, password: NEW_PASSWORD });
    expect(ok.status).toBe(204);
    expect((await user.agent.get('/api/me')).status).toBe(401);
    expect((await otherDevice.get('/api/me')).status).toBe(401);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: user.user.email, password: TEST_PASSWORD })).status).toBe(401);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: user.user.email, password: NEW_PASSWORD })).status).toBe(200);

    const reused = await agent(app).post('/api/password-resets/confirm').send({ token: second, password: 'yet another long password' });
    expect(reused.status).toBe(410);
    expect(errorOf(reused).code).toBe('gone');
    const older = await agent(app).post('/api/password-resets/confirm').send({ token: first, password: 'yet another long password' });
    expect(older.status).toBe(410);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: user.user.email, password: NEW_PASSWORD })).status).toBe(200);
  });

  it('keeps the session of the same account that sets the new password', async () => {
    const user = await signUp(app, 'signed-in-resetter');
    await agent(app).post('/api/password-resets').send({ email: user.user.email });
    const token = await resetTokenFor(user.user.email);
    expect((await user.agent.post('/api/password-resets/confirm').send({ token, password: NEW_PASSWORD })).status).toBe(204);
    expect((await user.agent.get('/api/me')).status).toBe(200);
  });

  it('answers 410 for an expired link and leaves the password as it was', async () => {
    const user = await signUp(app, 'slow');
    await agent(app).post('/api/password-resets').send({ email: user.user.email });
    const token = await resetTokenFor(user.user.email);
    await db('password_resets').where({ token_hash: hashLinkToken(token) }).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await agent(app).post('/api/password-resets/check').send({ token })).status).toBe(410);
    const res = await agent(app).post('/api/password-resets/confirm').send({ token, password: NEW_PASSWORD });
    expect(res.status).toBe(410);
    expect(errorOf(res).message).toMatch(/expired/);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: user.user.email, password: TEST_PASSWORD })).status).toBe(200);
    expect((await user.agent.get('/api/me')).status).toBe(200);
  });

  it('answers 404 for an unknown token and 400 for a malformed one', async () => {
    expect((await agent(app).post('/api/password-resets/check').send({ token: 'B'.repeat(43) })).status).toBe(404);
    expect((await agent(app).post('/api/password-resets/confirm').send({ token: 'B'.repeat(43), password: NEW_PASSWORD })).status).toBe(404);
    expect((await agent(app).post('/api/password-resets/check').send({ token: '../x' })).status).toBe(400);
  });
});
