import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { BenchListResponse, BenchResponse, MemberListResponse, MemberResponse } from '../../server/contracts/benches';
import { addMember, closeTestDb, createBench, errorOf, makeTestApp, signUp, uniqueEmail } from '../helpers/api-app';

afterAll(closeTestDb);

const { app, db } = makeTestApp();

describe('benches', () => {
  it('POST /api/benches creates a bench with the creator as owner (201 {bench})', async () => {
    const mira = await signUp(app, 'mira');
    const res = await mira.agent.post('/api/benches').send({ name: '  Narrow-linewidth bench ', description: 'ECL and DFB' });
    expect(res.status).toBe(201);
    const { bench } = BenchResponse.parse(res.body);
    expect(bench).toMatchObject({ name: 'Narrow-linewidth bench', description: 'ECL and DFB', role: 'owner' });
    const members = await mira.agent.get(`/api/benches/${bench.id}/members`);
    expect(MemberListResponse.parse(members.body).members).toEqual([
      expect.objectContaining({ userId: mira.user.id, email: mira.user.email, role: 'owner' }),
    ]);
  });

  it('POST /api/benches names the bad field (name) in validation_failed', async () => {
    const mira = await signUp(app);
    const res = await mira.agent.post('/api/benches').send({ name: '', description: 42 });
    expect(res.status).toBe(400);
    const error = errorOf(res);
    expect(error.code).toBe('validation_failed');
    expect(error.details!.map((d) => d.path).sort()).toEqual(['description', 'name']);
  });

  it('GET /api/benches lists only my benches, with my role and member and laser counts', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const stranger = await signUp(app);
    const a = await createBench(mira, 'Alpha bench');
    const b = await createBench(tomas, 'Beta bench');
    await createBench(stranger, 'Not yours');
    await addMember(tomas, b, mira, 'viewer');
    await mira.agent.post(`/api/benches/${a}/lasers`).send({ name: 'L1', type: 'dfb' });
    await mira.agent.post(`/api/benches/${a}/lasers`).send({ name: 'L2', type: 'fibre' });

    const res = await mira.agent.get('/api/benches');
    expect(res.status).toBe(200);
    const { benches } = BenchListResponse.parse(res.body);
    expect(benches.map((x) => [x.name, x.role, x.memberCount, x.laserCount])).toEqual([
      ['Alpha bench', 'owner', 1, 2],
      ['Beta bench', 'viewer', 2, 0],
    ]);
  });

  it('GET /api/benches without a session answers 401', async () => {
    const res = await request(app).get('/api/benches');
    expect(res.status).toBe(401);
    expect(errorOf(res).code).toBe('unauthenticated');
  });

  it('GET /api/benches/:benchId returns {bench} with my role', async () => {
    const mira = await signUp(app);
    const id = await createBench(mira, 'Readable');
    const res = await mira.agent.get(`/api/benches/${id}`);
    expect(res.status).toBe(200);
    expect(BenchResponse.parse(res.body).bench).toMatchObject({ id, name: 'Readable', description: null, role: 'owner' });
  });

  it('PATCH /api/benches/:benchId renames and clears the description (owner)', async () => {
    const mira = await signUp(app);
    const created = await mira.agent.post('/api/benches').send({ name: 'Old', description: 'to clear' });
    const id = created.body.bench.id;
    const res = await mira.agent.patch(`/api/benches/${id}`).send({ name: 'New', description: null });
    expect(res.status).toBe(200);
    expect(res.body.bench).toMatchObject({ id, name: 'New', description: null, role: 'owner' });
  });

  it('DELETE /api/benches/:benchId answers 204 and removes memberships and lasers with it', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira, 'Doomed');
    await addMember(mira, id, tomas, 'analyst');
    await mira.agent.post(`/api/benches/${id}/lasers`).send({ name: 'Gone soon', type: 'vcsel' });
    const res = await mira.agent.delete(`/api/benches/${id}`);
    expect(res.status).toBe(204);
    expect(await db('benches').where({ id }).first()).toBeUndefined();
    expect(await db('bench_members').where({ bench_id: id })).toEqual([]);
    expect(await db('lasers').where({ bench_id: id })).toEqual([]);
    expect((await mira.agent.get(`/api/benches/${id}`)).status).toBe(404);
    expect((await tomas.agent.get(`/api/benches/${id}`)).status).toBe(404);
  });

  it('answers 404 not_found for a bench id that does not exist or is malformed', async () => {
    const mira = await signUp(app);
    for (const id of ['aaaaaaaaaaaaaaaaaaaaaaaa', 'not-an-id', '1']) {
      const res = await mira.agent.get(`/api/benches/${id}`);
      expect(res.status).toBe(404);
      expect(errorOf(res).code).toBe('not_found');
    }
  });

  it('gives ids as 24 random base32 characters, not numbers', async () => {
    const mira = await signUp(app);
    const a = await createBench(mira, 'id one');
    const b = await createBench(mira, 'id two');
    expect(a).toMatch(/^[a-z2-7]{24}$/);
    expect(b).toMatch(/^[a-z2-7]{24}$/);
    expect(a).not.toBe(b);
    expect(mira.user.id).toMatch(/^[a-z2-7]{24}$/);
  });
});

describe('members', () => {
  it('POST members adds an existing account by e-mail (any case) with a role: 201 {member}', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app, 'tomas');
    const id = await createBench(mira);
    const res = await mira.agent.post(`/api/benches/${id}/members`).send({ email: tomas.user.email.toUpperCase(), role: 'analyst' });
    expect(res.status).toBe(201);
    const { member } = MemberResponse.parse(res.body);
    expect(member).toMatchObject({ userId: tomas.user.id, email: tomas.user.email, name: 'tomas', role: 'analyst' });
    const bench = await tomas.agent.get(`/api/benches/${id}`);
    expect(bench.body.bench.role).toBe('analyst');
  });

  it('POST members answers 404 "no account with that e-mail" for an unknown e-mail', async () => {
    const mira = await signUp(app);
    const id = await createBench(mira);
    const res = await mira.agent.post(`/api/benches/${id}/members`).send({ email: uniqueEmail('ghost'), role: 'viewer' });
    expect(res.status).toBe(404);
    expect(errorOf(res)).toEqual({ code: 'not_found', message: 'no account with that e-mail' });
  });

  it('POST members answers 409 for someone who is already a member', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'viewer');
    const res = await mira.agent.post(`/api/benches/${id}/members`).send({ email: tomas.user.email, role: 'analyst' });
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toContain('already a member');
  });

  it('POST members names the bad fields (email, role)', async () => {
    const mira = await signUp(app);
    const id = await createBench(mira);
    const res = await mira.agent.post(`/api/benches/${id}/members`).send({ email: 'nope', role: 'admin' });
    expect(res.status).toBe(400);
    expect(errorOf(res).details!.map((d) => d.path).sort()).toEqual(['email', 'role']);
  });

  it('PATCH members/:userId changes a role: {member}', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'viewer');
    const res = await mira.agent.patch(`/api/benches/${id}/members/${tomas.user.id}`).send({ role: 'owner' });
    expect(res.status).toBe(200);
    expect(res.body.member).toMatchObject({ userId: tomas.user.id, role: 'owner' });
  });

  it('PATCH members/:userId answers 404 for someone who is not a member', async () => {
    const mira = await signUp(app);
    const outsider = await signUp(app);
    const id = await createBench(mira);
    const res = await mira.agent.patch(`/api/benches/${id}/members/${outsider.user.id}`).send({ role: 'viewer' });
    expect(res.status).toBe(404);
  });

  it('the last owner cannot be demoted (409) — after another owner is made, they can', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'analyst');
    const refused = await mira.agent.patch(`/api/benches/${id}/members/${mira.user.id}`).send({ role: 'analyst' });
    expect(refused.status).toBe(409);
    expect(errorOf(refused)).toEqual({
      code: 'conflict',
      message: 'the last owner of a bench cannot be demoted; make another member owner first',
    });
    await mira.agent.patch(`/api/benches/${id}/members/${tomas.user.id}`).send({ role: 'owner' }).expect(200);
    const ok = await mira.agent.patch(`/api/benches/${id}/members/${mira.user.id}`).send({ role: 'viewer' });
    expect(ok.status).toBe(200);
    expect(ok.body.member.role).toBe('viewer');
  });

  it('the last owner cannot leave (409); another member can leave (204)', async () => {
    const mira = await signUp(app);
    const ines = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, ines, 'viewer');
    const refused = await mira.agent.delete(`/api/benches/${id}/members/${mira.user.id}`);
    expect(refused.status).toBe(409);
    expect(errorOf(refused).message).toContain('the last owner cannot leave');
    const left = await ines.agent.delete(`/api/benches/${id}/members/${ines.user.id}`);
    expect(left.status).toBe(204);
    expect((await ines.agent.get(`/api/benches/${id}`)).status).toBe(404);
  });

  it('an owner removes another member (204); the removed member loses access', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'analyst');
    expect((await mira.agent.delete(`/api/benches/${id}/members/${tomas.user.id}`)).status).toBe(204);
    const after = await tomas.agent.get(`/api/benches/${id}/lasers`);
    expect(after.status).toBe(404);
  });

  it('with two owners, one may leave and the other stays owner', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'owner');
    expect((await mira.agent.delete(`/api/benches/${id}/members/${mira.user.id}`)).status).toBe(204);
    const members = await tomas.agent.get(`/api/benches/${id}/members`);
    expect(members.body.members).toEqual([expect.objectContaining({ userId: tomas.user.id, role: 'owner' })]);
  });

  it('two owners demoting each other at once leave at least one owner', async () => {
    const mira = await signUp(app);
    const tomas = await signUp(app);
    const id = await createBench(mira);
    await addMember(mira, id, tomas, 'owner');
    const [a, b] = await Promise.all([
      mira.agent.patch(`/api/benches/${id}/members/${tomas.user.id}`).send({ role: 'viewer' }),
      tomas.agent.patch(`/api/benches/${id}/members/${mira.user.id}`).send({ role: 'viewer' }),
    ]);
    // whichever runs first wins; the other is refused as the last owner (409), or as no longer an owner (403)
    const statuses = [a.status, b.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const owners = await db('bench_members').where({ bench_id: id, role: 'owner' });
    expect(owners.length).toBe(1);
  });
});
