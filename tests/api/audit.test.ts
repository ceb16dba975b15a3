// The audit trail: uploads, deletions, analyses, member changes and sign-ins recorded with who, what,
// when and which bench; GET /api/benches/:benchId/audit for owners only, with filters and pages; rows
// never updated or deleted by the app (the server code is searched for it) and kept when the bench
// is deleted.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { projectRoot } from '../../server/config/env';
import { recordAudit } from '../../server/modules/audit/record-audit';
import { addMember, agent, closeTestDb, createBench, errorOf, makeTestApp, signUp, TEST_PASSWORD, type SignedIn } from '../helpers/api-app';

let app: Express;
let db: ReturnType<typeof makeTestApp>['db'];
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let captureId: string;

interface EventBody {
  id: string;
  action: string;
  actor: { id: string | null; email: string | null };
  targetId: string | null;
  details: Record<string, unknown> | null;
  at: string;
  benchId: string | null;
}

const auditOf = async (query = '') => {
  const res = await owner.agent.get(`/api/benches/${benchId}/audit${query}`);
  expect(res.status).toBe(200);
  return res.body as { events: EventBody[]; nextBefore: string | null };
};

/** A small IQ record (float32 pairs on the unit circle), enough for the upload path. */
function iqBytes(n = 4096): Buffer {
  const out = new Float32Array(2 * n);
  for (let i = 0; i < n; i++) {
    out[2 * i] = Math.cos(0.01 * i);
    out[2 * i + 1] = Math.sin(0.01 * i);
  }
  return Buffer.from(out.buffer);
}

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Audit bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  const up = await analyst.agent
    .post(`/api/benches/${benchId}/captures`)
    .field('kind', 'iq')
    .field('sampleRateHz', '100000')
    .field('format', 'raw')
    .field('dtype', 'float32')
    .field('channels', '2')
    .attach('file', iqBytes(), 'audit-run.f32');
  expect(up.status).toBe(201);
  captureId = up.body.capture.id;
});

afterAll(async () => {
  await closeTestDb();
});

describe('GET /api/benches/:benchId/audit', () => {
  it('answers owners; analysts and viewers 403, outsiders 404, anonymous callers 401', async () => {
    expect((await owner.agent.get(`/api/benches/${benchId}/audit`)).status).toBe(200);
    const a = await analyst.agent.get(`/api/benches/${benchId}/audit`);
    expect(a.status).toBe(403);
    expect(errorOf(a).code).toBe('forbidden');
    expect((await viewer.agent.get(`/api/benches/${benchId}/audit`)).status).toBe(403);
    expect((await outsider.agent.get(`/api/benches/${benchId}/audit`)).status).toBe(404);
    expect((await agent(app).get(`/api/benches/${benchId}/audit`)).status).toBe(401);
  });

  it('records members added and an upload, with who, what, when and the bench', async () => {
    const { events } = await auditOf();
    const added = events.filter((e) => e.action === 'member.added');
    expect(added.map((e) => e.details?.email).sort()).toEqual([analyst.user.email, viewer.user.email].sort());
    expect(added.every((e) => e.actor.id === owner.user.id && e.benchId === benchId)).toBe(true);
    const upload = events.find((e) => e.action === 'capture.uploaded');
    expect(upload).toMatchObject({ actor: { id: analyst.user.id, email: analyst.user.email }, targetId: captureId });
    expect(upload?.details?.fileName).toBe('audit-run.f32');
    expect(Date.now() - Date.parse(upload?.at ?? '')).toBeLessThan(10 * 60_000);
  });

  it('records new analyses, role changes, removals, deletions and members’ sign-ins (not outsiders’)', async () => {
    const created = await analyst.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: { segment: 1024 } });
    expect(created.status).toBe(201);
    expect((await owner.agent.patch(`/api/benches/${benchId}/members/${viewer.user.id}`).send({ role: 'analyst' })).status).toBe(200);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: viewer.user.email, password: TEST_PASSWORD })).status).toBe(200);
    expect((await agent(app).post('/api/auth/sign-in').send({ email: outsider.user.email, password: TEST_PASSWORD })).status).toBe(200);
    expect((await owner.agent.delete(`/api/benches/${benchId}/members/${viewer.user.id}`)).status).toBe(204);
    expect((await analyst.agent.delete(`/api/captures/${captureId}`)).status).toBe(204);

    const { events } = await auditOf();
    const actions = events.map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['analysis.created', 'member.role_changed', 'member.removed', 'capture.deleted']));
    expect(events.find((e) => e.action === 'member.role_changed')?.details).toMatchObject({ from: 'viewer', to: 'analyst' });
    const signIns = events.filter((e) => e.action === 'auth.signed_in').map((e) => e.actor.id);
    expect(signIns).not.toContain(outsider.user.id);
    // the removed member's sign-ins leave the bench's view with them; the removal itself stays
    expect(signIns).not.toContain(viewer.user.id);
    expect(events.find((e) => e.action === 'member.removed')?.targetId).toBe(viewer.user.id);
    // newest first
    const times = events.map((e) => Date.parse(e.at));
    expect([...times].sort((x, y) => y - x)).toEqual(times);
  });

  it('shows a current member’s sign-ins', async () => {
    expect((await agent(app).post('/api/auth/sign-in').send({ email: analyst.user.email, password: TEST_PASSWORD })).status).toBe(200);
    const { events } = await auditOf(`?action=auth.signed_in&actorId=${analyst.user.id}`);
    expect(events.length).toBe(1);
    expect(events[0].benchId).toBeNull();
  });

  it('filters by action, person and date range, and pages with nextBefore', async () => {
    const byAction = await auditOf('?action=member.added');
    expect(byAction.events.length).toBe(2);
    const byPerson = await auditOf(`?actorId=${analyst.user.id}`);
    expect(byPerson.events.length).toBeGreaterThan(0);
    expect(byPerson.events.every((e) => e.actor.id === analyst.user.id)).toBe(true);
    const future = new Date(Date.now() + 3600_000).toISOString();
    expect((await auditOf(`?from=${future}`)).events).toEqual([]);
    const all = (await auditOf()).events;
    const oldest = all.at(-1)!;
    const upTo = await auditOf(`?to=${encodeURIComponent(new Date(Date.parse(oldest.at) + 1).toISOString())}`);
    expect(upTo.events.map((e) => e.id)).toContain(oldest.id);

    const pages: string[] = [];
    let cursor: string | null = null;
    do {
      const page: { events: EventBody[]; nextBefore: string | null } = await auditOf(`?limit=2${cursor ? `&before=${encodeURIComponent(cursor)}` : ''}`);
      pages.push(...page.events.map((e) => e.id));
      cursor = page.nextBefore;
    } while (cursor);
    expect(pages).toEqual(all.map((e) => e.id));
  });

  it('refuses bad filters (400)', async () => {
    const res = await owner.agent.get(`/api/benches/${benchId}/audit?action=everything&from=yesterday&limit=0`);
    expect(res.status).toBe(400);
    expect(errorOf(res).details?.map((d) => d.path).sort()).toEqual(['action', 'from', 'limit']);
  });
});

describe('recordAudit', () => {
  it('rolls back with the transaction it joined', async () => {
    const before = (await auditOf()).events.length;
    await expect(
      db.transaction(async (trx) => {
        await recordAudit(trx, { benchId, actorId: owner.user.id, action: 'share_link.created', targetType: 'share_link', targetId: null });
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    expect((await auditOf()).events.length).toBe(before);
    await recordAudit(db, { benchId, actorId: owner.user.id, action: 'share_link.revoked', targetType: 'share_link', targetId: 'x', details: { a: 1 } });
    const [latest] = (await auditOf()).events;
    expect(latest).toMatchObject({ action: 'share_link.revoked', targetId: 'x', details: { a: 1 }, actor: { email: owner.user.email } });
  });
});

describe('the trail is append-only', () => {
  function serverFiles(dir: string): string[] {
    return readdirSync(dir).flatMap((name) => {
      const full = path.join(dir, name);
      return statSync(full).isDirectory() ? serverFiles(full) : full.endsWith('.ts') ? [full] : [];
    });
  }

  it('no file in server/ updates, deletes or truncates audit_events; only the audit repository names the table', () => {
    const naming = serverFiles(path.join(projectRoot, 'server')).filter((f) => /audit_events/.test(readFileSync(f, 'utf8')));
    expect(naming.map((f) => path.relative(projectRoot, f))).toEqual(['server/modules/audit/audit.repository.ts']);
    const code = readFileSync(naming[0], 'utf8').replace(/\/\*[\s\S]*?\*\/|\/\/.*$/gm, '');
    expect(code).not.toMatch(/\.(update|delete|del|truncate|increment|decrement|upsert|merge|onConflict)\s*\(/);
    expect(code).not.toMatch(/\b(UPDATE|DELETE|TRUNCATE|REPLACE|DROP)\b/);
    expect(code).not.toMatch(/\.raw\s*\(\s*['"`]\s*(update|delete|truncate|replace)/i);
  });

  it('keeps a deleted bench’s rows', async () => {
    const other = await createBench(owner, 'Short-lived bench');
    await addMember(owner, other, viewer, 'viewer');
    expect((await owner.agent.delete(`/api/benches/${other}`)).status).toBe(204);
    const rows = await db('audit_events').where({ bench_id: other });
    expect(rows.map((r: { action: string }) => r.action)).toEqual(['member.added']);
  });
});
