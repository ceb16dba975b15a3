/**
 * Comment routes across roles: GET/POST /api/captures/:captureId/comments, DELETE /api/comments/:id —
 * one thread per capture (shown on every analysis of it); owners and analysts add, the author or an
 * owner deletes, viewers read (403 on writes), members of other benches 404 on every id; empty text
 * is 400 with nothing stored.
 */
import type { Express } from 'express';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addMember, agent, closeTestDb, createBench, errorOf, makeTestApp, signUp, type Agent, type SignedIn } from '../helpers/api-app';

function upload(a: Agent, benchId: string, name: string) {
  const out = new Float32Array(2 * 4096);
  for (let i = 0; i < 4096; i++) {
    out[2 * i] = Math.cos(0.02 * i);
    out[2 * i + 1] = Math.sin(0.02 * i);
  }
  const fields = { kind: 'iq', sampleRateHz: '100000', format: 'raw', dtype: 'float32', channels: '2' };
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', Buffer.from(out.buffer), name);
}

let app: Express;
let db: Knex;
let owner: SignedIn;
let analyst: SignedIn;
let analyst2: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let captureId: string;

const threadOf = (id = captureId) => `/api/captures/${id}/comments`;
const countComments = async () => Number(((await db('comments').where({ capture_id: captureId }).count({ n: '*' })) as { n: number }[])[0].n);

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  analyst2 = await signUp(app, 'analyst2');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  const benchId = await createBench(owner, 'Comments bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, analyst2, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  await createBench(outsider, 'Another bench');
  const res = await upload(analyst.agent, benchId, 'heron-fl.f32');
  expect(res.status).toBe(201);
  captureId = res.body.capture.id;
}, 60_000);

afterAll(async () => {
  await closeTestDb();
});

describe('comment thread of a capture', () => {
  let analystCommentId: string;
  let ownerCommentId: string;

  it('GET /api/captures/:captureId/comments starts empty for any member', async () => {
    for (const who of [owner, analyst, viewer]) {
      const res = await who.agent.get(threadOf());
      expect(res.status).toBe(200);
      expect(res.body).toEqual({ comments: [] });
    }
  });

  it('POST as an analyst adds a comment (201, trimmed text, author, canDelete)', async () => {
    const res = await analyst.agent.post(threadOf()).send({ text: '  The bump near 30 kHz moves with pump current.  ' });
    expect(res.status).toBe(201);
    expect(res.body.comment).toMatchObject({
      captureId,
      text: 'The bump near 30 kHz moves with pump current.',
      authorId: analyst.user.id,
      authorName: 'analyst',
      canDelete: true,
    });
    analystCommentId = res.body.comment.id;
  });

  it('POST as an owner adds a comment; GET lists the thread oldest first', async () => {
    const res = await owner.agent.post(threadOf()).send({ text: 'Agreed: relaxation oscillation.' });
    expect(res.status).toBe(201);
    ownerCommentId = res.body.comment.id;
    const list = await viewer.agent.get(threadOf());
    expect(list.body.comments.map((c: { id: string }) => c.id)).toEqual([analystCommentId, ownerCommentId]);
    expect(list.body.comments.map((c: { canDelete: boolean }) => c.canDelete)).toEqual([false, false]);
    const asOwner = await owner.agent.get(threadOf());
    expect(asOwner.body.comments.map((c: { canDelete: boolean }) => c.canDelete)).toEqual([true, true]);
    const asAnalyst = await analyst.agent.get(threadOf());
    expect(asAnalyst.body.comments.map((c: { canDelete: boolean }) => c.canDelete)).toEqual([true, false]);
  });

  it('POST as a viewer answers 403 and stores nothing', async () => {
    const before = await countComments();
    const res = await viewer.agent.post(threadOf()).send({ text: 'I would like to say something' });
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('forbidden');
    expect(await countComments()).toBe(before);
  });

  it('GET and POST as a member of another bench answer 404', async () => {
    expect((await outsider.agent.get(threadOf())).status).toBe(404);
    expect((await outsider.agent.post(threadOf()).send({ text: 'hello' })).status).toBe(404);
  });

  it('an unknown or malformed capture id answers 404; no session answers 401', async () => {
    expect((await owner.agent.get(threadOf('aaaaaaaaaaaaaaaaaaaaaaaa'))).status).toBe(404);
    expect((await owner.agent.get(threadOf('zzz'))).status).toBe(404);
    expect((await agent(app).get(threadOf())).status).toBe(401);
  });

  const bad: [string, unknown, string][] = [
    ['empty text', { text: '' }, 'text'],
    ['blank text', { text: '   \n ' }, 'text'],
    ['no text', {}, 'text'],
    ['text over 4000 characters', { text: 'x'.repeat(4001) }, 'text'],
    ['an unknown field', { text: 'ok', pinned: true }, ''],
  ];
  for (const [name, body, path] of bad) {
    it(`POST with ${name} → 400 naming ${path || 'the body'}, nothing stored`, async () => {
      const before = await countComments();
      const res = await analyst.agent.post(threadOf()).send(body as object);
      expect(res.status).toBe(400);
      const error = errorOf(res);
      expect(error.code).toBe('validation_failed');
      expect(error.details?.some((d) => d.path === path)).toBe(true);
      expect(await countComments()).toBe(before);
    });
  }

  it('DELETE by another analyst or a viewer answers 403; by an outsider 404; nothing deleted', async () => {
    expect((await analyst2.agent.delete(`/api/comments/${analystCommentId}`)).status).toBe(403);
    expect((await viewer.agent.delete(`/api/comments/${analystCommentId}`)).status).toBe(403);
    expect((await analyst.agent.delete(`/api/comments/${ownerCommentId}`)).status).toBe(403);
    const res = await outsider.agent.delete(`/api/comments/${analystCommentId}`);
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
    expect(await countComments()).toBe(2);
  });

  it('DELETE by the author answers 204, then 404', async () => {
    expect((await analyst.agent.delete(`/api/comments/${analystCommentId}`)).status).toBe(204);
    expect((await analyst.agent.delete(`/api/comments/${analystCommentId}`)).status).toBe(404);
  });

  it('DELETE by an owner removes anyone’s comment', async () => {
    const added = await analyst2.agent.post(threadOf()).send({ text: 'a note from analyst 2' });
    expect((await owner.agent.delete(`/api/comments/${added.body.comment.id}`)).status).toBe(204);
    expect((await owner.agent.delete(`/api/comments/${ownerCommentId}`)).status).toBe(204);
    expect(await countComments()).toBe(0);
  });

  it('DELETE of a malformed id answers 404', async () => {
    expect((await owner.agent.delete('/api/comments/nope')).status).toBe(404);
  });
});
