// Invitations by e-mail, read from the real mail catcher: an owner invites an address with a role,
// the link in the caught message creates the account (or adds the membership of an existing one),
// once; a used or expired link answers 410 and changes nothing; every route across roles.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailCatcher, type MailCatcher } from '../../server/mail/mail-catcher';
import { listCaughtMessages } from '../../server/mail/outbox-store';
import { hashLinkToken } from '../../server/mail/link-token';
import {
  addMember,
  agent,
  closeTestDb,
  createBench,
  errorOf,
  makeTestApp,
  PUBLIC_URL,
  signUp,
  TEST_PASSWORD,
  uniqueEmail,
  type SignedIn,
} from '../helpers/api-app';

let catcher: MailCatcher;
let dir: string;
let app: Express;
let db: ReturnType<typeof makeTestApp>['db'];
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;

/** The invitation link in the newest message to `to` (waits for the catcher). */
async function linkSentTo(to: string): Promise<{ token: string; subject: string; text: string }> {
  for (let i = 0; i < 100; i++) {
    const m = (await listCaughtMessages(dir)).find((x) => x.recipients.includes(to));
    if (m) {
      const match = /(\S+)\/invitation\/([A-Za-z0-9_-]{43})\b/.exec(m.text);
      if (!match) throw new Error(`no invitation link in: ${m.text}`);
      expect(match[1]).toBe(PUBLIC_URL);
      return { token: match[2], subject: m.subject, text: m.text };
    }
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no message to ${to}`);
}

async function invite(email: string, role = 'analyst') {
  const res = await owner.agent.post(`/api/benches/${benchId}/invitations`).send({ email, role });
  expect(res.status).toBe(201);
  expect(res.body.emailSent).toBe(true);
  return { id: res.body.invitation.id as string, ...(await linkSentTo(email)) };
}

const memberEmails = async () =>
  ((await owner.agent.get(`/api/benches/${benchId}/members`)).body.members as { email: string; role: string }[]).map(
    (m) => `${m.email}:${m.role}`,
  );

beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'phaseloom-outbox-'));
  catcher = await startMailCatcher({ port: 0, dir });
  ({ app, db } = makeTestApp({ env: { PHASELOOM_SMTP_PORT: catcher.port, PHASELOOM_OUTBOX_DIR: dir } }));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Invitation bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
});

afterAll(async () => {
  await catcher.close();
  rmSync(dir, { recursive: true, force: true });
  await closeTestDb();
});

describe('POST /api/benches/:benchId/invitations', () => {
  it('mails a single-use link to the address; only a hash of its token is stored', async () => {
    const email = uniqueEmail('colleague');
    const { id, token, subject, text } = await invite(email, 'viewer');
    expect(subject).toContain('Invitation bench');
    expect(text).toContain('as viewer');
    const row = await db('invitations').where({ id }).first();
    expect(row.token_hash).toBe(hashLinkToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    // 7 days, to the second
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBe(7 * 24 * 3600 * 1000);
  });

  it('refuses analysts and viewers (403), outsiders (404) and anonymous callers (401)', async () => {
    const body = { email: uniqueEmail('x'), role: 'viewer' };
    expect((await analyst.agent.post(`/api/benches/${benchId}/invitations`).send(body)).status).toBe(403);
    expect((await viewer.agent.post(`/api/benches/${benchId}/invitations`).send(body)).status).toBe(403);
    expect((await outsider.agent.post(`/api/benches/${benchId}/invitations`).send(body)).status).toBe(404);
    expect((await agent(app).post(`/api/benches/${benchId}/invitations`).send(body)).status).toBe(401);
    expect(await listCaughtMessages(dir).then((ms) => ms.some((m) => m.recipients.includes(body.email)))).toBe(false);
  });

  it('refuses a bad address or role (400) and a current member (409)', async () => {
    const bad = await owner.agent.post(`/api/benches/${benchId}/invitations`).send({ email: 'not-an-address', role: 'chief' });
    expect(bad.status).toBe(400);
    expect(errorOf(bad).details?.map((d) => d.path).sort()).toEqual(['email', 'role']);
    const member = await owner.agent.post(`/api/benches/${benchId}/invitations`).send({ email: viewer.user.email, role: 'owner' });
    expect(member.status).toBe(409);
  });
});

describe('GET /api/benches/:benchId/invitations', () => {
  it('lists invitations with their status for owners; analysts and viewers 403, outsiders 404', async () => {
    const res = await owner.agent.get(`/api/benches/${benchId}/invitations`);
    expect(res.status).toBe(200);
    expect(res.body.invitations.length).toBeGreaterThan(0);
    expect(res.body.invitations[0]).toMatchObject({ status: 'pending', invitedBy: { email: owner.user.email } });
    expect((await analyst.agent.get(`/api/benches/${benchId}/invitations`)).status).toBe(403);
    expect((await viewer.agent.get(`/api/benches/${benchId}/invitations`)).status).toBe(403);
    expect((await outsider.agent.get(`/api/benches/${benchId}/invitations`)).status).toBe(404);
  });
});

describe('following the link', () => {
  it('previews, creates the account with the invited address, signs in and joins with the role — once', async () => {
    const email = uniqueEmail('newcomer');
    const { token } = await invite(email, 'analyst');
    const preview = await agent(app).post('/api/invitations/preview').send({ token });
    expect(preview.status).toBe(200);
    expect(preview.body.invitation).toMatchObject({ benchName: 'Invitation bench', email, role: 'analyst', accountExists: false });

    const missing = await agent(app).post('/api/invitations/accept').send({ token });
    expect(missing.status).toBe(400);

    const newcomer = agent(app);
    const res = await newcomer.post('/api/invitations/accept').send({ token, name: 'Newcomer', password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ benchId, accountCreated: true, user: { email, name: 'Newcomer' } });
    const me = await newcomer.get('/api/me');
    expect(me.body.user.email).toBe(email);
    expect((await newcomer.get(`/api/benches/${benchId}`)).body.bench.role).toBe('analyst');

    const before = await memberEmails();
    const again = await agent(app).post('/api/invitations/accept').send({ token, name: 'Twice', password: TEST_PASSWORD });
    expect(again.status).toBe(410);
    expect(errorOf(again).code).toBe('gone');
    expect((await agent(app).post('/api/invitations/preview').send({ token })).status).toBe(410);
    expect(await memberEmails()).toEqual(before);
    const list = await owner.agent.get(`/api/benches/${benchId}/invitations`);
    expect(list.body.invitations.find((i: { email: string }) => i.email === email).status).toBe('accepted');
  });

  it('answers 410 for an expired link and creates nothing', async () => {
    const email = uniqueEmail('late');
    const { id, token } = await invite(email, 'viewer');
    await db('invitations').where({ id }).update({ expires_at: new Date(Date.now() - 1000) });
    const preview = await agent(app).post('/api/invitations/preview').send({ token });
    expect(preview.status).toBe(410);
    expect(errorOf(preview).message).toMatch(/expired/);
    const res = await agent(app).post('/api/invitations/accept').send({ token, name: 'Late', password: TEST_PASSWORD });
    expect(res.status).toBe(410);
    expect(await db('users').where({ email }).first()).toBeUndefined();
    expect((await db('invitations').where({ id }).first()).accepted_at).toBeNull();
  });

  it('adds the membership of an existing account once it is signed in with the invited address', async () => {
    const existing = await signUp(app, 'existing');
    const { token } = await invite(existing.user.email, 'viewer');
    expect((await agent(app).post('/api/invitations/preview').send({ token })).body.invitation.accountExists).toBe(true);
    const anonymous = await agent(app).post('/api/invitations/accept').send({ token, name: 'X', password: TEST_PASSWORD });
    expect(anonymous.status).toBe(409);
    const wrong = await outsider.agent.post('/api/invitations/accept').send({ token });
    expect(wrong.status).toBe(403);
    expect((await outsider.agent.get(`/api/benches/${benchId}`)).status).toBe(404);
    const res = await existing.agent.post('/api/invitations/accept').send({ token });
    expect(res.status).toBe(200);
    expect(res.body.accountCreated).toBe(false);
    expect((await existing.agent.get(`/api/benches/${benchId}`)).body.bench.role).toBe('viewer');
  });

  it('answers 404 for an unknown token and 400 for a malformed one', async () => {
    const unknown = 'A'.repeat(43);
    expect((await agent(app).post('/api/invitations/preview').send({ token: unknown })).status).toBe(404);
    expect((await agent(app).post('/api/invitations/accept').send({ token: unknown, name: 'N', password: TEST_PASSWORD })).status).toBe(404);
    expect((await agent(app).post('/api/invitations/preview').send({ token: 'short' })).status).toBe(400);
  });

  it('records the invitation and its acceptance in the audit trail', async () => {
    const res = await owner.agent.get(`/api/benches/${benchId}/audit?action=invitation.accepted`);
    expect(res.status).toBe(200);
    expect(res.body.events.length).toBe(2);
    const created = await owner.agent.get(`/api/benches/${benchId}/audit?action=invitation.created`);
    expect(created.body.events[0].actor.id).toBe(owner.user.id);
  });
});
