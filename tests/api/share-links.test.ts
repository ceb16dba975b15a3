/**
 * Share links: POST /api/analyses/:id/share-links, POST /api/overlays/:id/share-links,
 * DELETE /api/share-links/:id, GET /api/benches/:benchId/share-links for every role; and the public
 * GET /api/shared/:token — tokens stored hashed, 404 for a guessed token, 410 once revoked or expired,
 * only the allowed keys in the reply (nothing else of the bench), rate-limited.
 */
import { createHash } from 'node:crypto';
import type { Express } from 'express';
import type { Knex } from 'knex';
import { pino } from 'pino';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { loadEnv } from '../../server/config/env';
import { newId } from '../../server/lib/ids';
import { createServices } from '../../server/services';
import { insertSpectrum } from '../helpers/api-spectra';
import { addMember, closeTestDb, createBench, errorOf, GENEROUS_LIMITS, makeTestApp, PUBLIC_URL, signUp, testDb, type SignedIn } from '../helpers/api-app';

// ---- rows made in the test: a capture on the bench and a done analysis of it (no engine run) ----

let app: Express;
let db: Knex;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let analysisId: string;
let captureId: string;
let secondId: string;
let queuedId: string;
let overlayId: string;
let outsiderAnalysisId: string;

const tokenOf = (url: string) => url.split('/shared/')[1];

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  [owner, analyst, viewer, outsider] = await Promise.all([signUp(app, 'owner'), signUp(app, 'analyst'), signUp(app, 'viewer'), signUp(app, 'outsider')]);
  benchId = await createBench(owner, 'Share bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  const otherBench = await createBench(outsider, 'Elsewhere');
  const laser = await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name: 'Share ECL', type: 'external-cavity', wavelengthNm: 1550.12 });
  ({ analysisId, captureId } = await insertSpectrum(db, benchId, owner.user.id, { laserId: laser.body.laser.id, fileName: 'shared-one.npy', outputPowerMw: 12 }));
  secondId = (await insertSpectrum(db, benchId, owner.user.id, { fileName: 'shared-two.npy' })).analysisId;
  // another capture on the bench that is not shared: it must not show up
  await insertSpectrum(db, benchId, owner.user.id, { fileName: 'private-three.npy' });
  queuedId = (await insertSpectrum(db, benchId, owner.user.id, { status: 'queued' })).analysisId;
  outsiderAnalysisId = (await insertSpectrum(db, otherBench, outsider.user.id)).analysisId;
  await db('marks').insert({ id: newId(), capture_id: captureId, author_id: owner.user.id, kind: 'mains', text: '50 Hz mains', lo_hz: 50, hi_hz: null, created_at: new Date(), updated_at: new Date() });
  const o = await analyst.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Shared comparison', analysisIds: [secondId, analysisId] });
  overlayId = o.body.overlay.id;
});

afterAll(closeTestDb);

describe('POST /api/analyses/:id/share-links', () => {
  it('returns 201 { id, url } with a 256-bit base64url token, and stores only its sha256', async () => {
    const res = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({});
    expect(res.status).toBe(201);
    expect(Object.keys(res.body).sort()).toEqual(['id', 'url']);
    expect(res.body.url).toMatch(new RegExp(`^${PUBLIC_URL}/shared/[A-Za-z0-9_-]{43}$`));
    const token = tokenOf(res.body.url);
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    const row = await db('share_links').where({ id: res.body.id }).first();
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(row.analysis_id).toBe(analysisId);
  });

  it('records the creation in the audit trail', async () => {
    const res = await owner.agent.post(`/api/analyses/${analysisId}/share-links`).send({});
    const event = await db('audit_events').where({ action: 'share_link.created', target_id: res.body.id }).first();
    expect(event).toMatchObject({ bench_id: benchId, actor_id: owner.user.id, target_type: 'share_link' });
  });

  it('accepts a future expiresAt and refuses a past one (400)', async () => {
    const future = new Date(Date.now() + 86_400_000).toISOString();
    const ok = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({ expiresAt: future });
    expect(ok.status).toBe(201);
    expect(new Date((await db('share_links').where({ id: ok.body.id }).first()).expires_at).toISOString()).toBe(future);
    const past = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({ expiresAt: '2020-01-01T00:00:00.000Z' });
    expect(past.status).toBe(400);
    expect(errorOf(past).details?.[0].path).toBe('expiresAt');
    expect((await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({ expiresAt: 'tomorrow' })).status).toBe(400);
  });

  it('refuses a viewer (403), an outsider (404), an unknown analysis (404) and an unfinished one (409)', async () => {
    expect((await viewer.agent.post(`/api/analyses/${analysisId}/share-links`).send({})).status).toBe(403);
    expect((await outsider.agent.post(`/api/analyses/${analysisId}/share-links`).send({})).status).toBe(404);
    expect((await owner.agent.post(`/api/analyses/${newId()}/share-links`).send({})).status).toBe(404);
    expect((await owner.agent.post(`/api/analyses/${outsiderAnalysisId}/share-links`).send({})).status).toBe(404);
    expect((await owner.agent.post(`/api/analyses/${queuedId}/share-links`).send({})).status).toBe(409);
    expect((await request(app).post(`/api/analyses/${analysisId}/share-links`).set('Origin', PUBLIC_URL).send({})).status).toBe(401);
  });
});

describe('POST /api/overlays/:id/share-links', () => {
  it('shares an overlay for owners and analysts; viewer 403, outsider 404, unknown 404', async () => {
    const res = await owner.agent.post(`/api/overlays/${overlayId}/share-links`).send({});
    expect(res.status).toBe(201);
    expect((await analyst.agent.post(`/api/overlays/${overlayId}/share-links`).send({})).status).toBe(201);
    expect((await viewer.agent.post(`/api/overlays/${overlayId}/share-links`).send({})).status).toBe(403);
    expect((await outsider.agent.post(`/api/overlays/${overlayId}/share-links`).send({})).status).toBe(404);
    expect((await owner.agent.post(`/api/overlays/${newId()}/share-links`).send({})).status).toBe(404);
  });
});

describe('GET /api/shared/:token', () => {
  const TOP_KEYS = ['expiresAt', 'kind', 'title', 'traces'];
  const TRACE_KEYS = ['color', 'figures', 'label', 'marks', 'provenance', 'series', 'settings'];
  const PROVENANCE_KEYS = ['analysedAt', 'capturedAt', 'fileName', 'format', 'kind', 'laserName', 'operatingPoint', 'sampleRateHz', 'sha256'];

  it('shows a shared spectrum without sign-in: only the allowed keys, nothing else of the bench', async () => {
    const link = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({});
    const res = await request(app).get(`/api/shared/${tokenOf(link.body.url)}`);
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(TOP_KEYS);
    expect(res.body.kind).toBe('analysis');
    expect(res.body.title).toBe('shared-one.npy');
    expect(res.body.traces).toHaveLength(1);
    const t = res.body.traces[0];
    expect(Object.keys(t).sort()).toEqual(TRACE_KEYS);
    expect(Object.keys(t.provenance).sort()).toEqual(PROVENANCE_KEYS);
    expect(t.figures.intrinsicLinewidthHz).toBe(1000);
    expect(t.provenance.laserName).toBe('Share ECL');
    expect(t.provenance.operatingPoint.outputPowerMw).toBe(12);
    expect(t.marks).toEqual([{ kind: 'mains', text: '50 Hz mains', frequencyHz: 50, bandHz: null }]);
    expect(t.series.frequencyHz).toEqual([10, 100, 1000, 10000]);
    const text = JSON.stringify(res.body);
    for (const secret of [benchId, captureId, analysisId, owner.user.id, analyst.user.id, owner.user.email, analyst.user.email, 'Share bench', 'private-three.npy', 'shared-two.npy']) {
      expect(text).not.toContain(secret);
    }
  });

  it('shows a shared overlay with its traces in order and their colours', async () => {
    const link = await analyst.agent.post(`/api/overlays/${overlayId}/share-links`).send({});
    const res = await request(app).get(`/api/shared/${tokenOf(link.body.url)}`);
    expect(res.status).toBe(200);
    expect(res.body.kind).toBe('overlay');
    expect(res.body.title).toBe('Shared comparison');
    expect(res.body.traces.map((t: { provenance: { fileName: string }; color: string }) => [t.provenance.fileName, t.color])).toEqual([
      ['shared-two.npy', '#0072B2'],
      ['shared-one.npy', '#D55E00'],
    ]);
    const text = JSON.stringify(res.body);
    for (const secret of [benchId, overlayId, secondId, analyst.user.email, 'private-three.npy']) expect(text).not.toContain(secret);
  });

  it('answers a guessed token 404 and a malformed one 404', async () => {
    const guess = Buffer.alloc(32, 7).toString('base64url');
    const res = await request(app).get(`/api/shared/${guess}`);
    expect(res.status).toBe(404);
    expect(errorOf(res).code).toBe('not_found');
    expect((await request(app).get('/api/shared/short')).status).toBe(404);
  });

  it('answers 410 once revoked (DELETE /api/share-links/:id → 204), and records the revocation', async () => {
    const link = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({});
    const token = tokenOf(link.body.url);
    expect((await request(app).get(`/api/shared/${token}`)).status).toBe(200);
    expect((await viewer.agent.delete(`/api/share-links/${link.body.id}`)).status).toBe(403);
    expect((await outsider.agent.delete(`/api/share-links/${link.body.id}`)).status).toBe(404);
    expect((await request(app).get(`/api/shared/${token}`)).status).toBe(200);
    expect((await owner.agent.delete(`/api/share-links/${link.body.id}`)).status).toBe(204);
    const gone = await request(app).get(`/api/shared/${token}`);
    expect(gone.status).toBe(410);
    expect(errorOf(gone).code).toBe('gone');
    expect(errorOf(gone).message).toMatch(/revoked/);
    expect((await analyst.agent.delete(`/api/share-links/${link.body.id}`)).status).toBe(204);
    expect(await db('audit_events').where({ action: 'share_link.revoked', target_id: link.body.id })).toHaveLength(1);
    expect((await owner.agent.delete(`/api/share-links/${newId()}`)).status).toBe(404);
  });

  it('answers 410 once expired', async () => {
    const link = await analyst.agent.post(`/api/analyses/${analysisId}/share-links`).send({ expiresAt: new Date(Date.now() + 3_600_000).toISOString() });
    await db('share_links').where({ id: link.body.id }).update({ expires_at: new Date(Date.now() - 1000) });
    const res = await request(app).get(`/api/shared/${tokenOf(link.body.url)}`);
    expect(res.status).toBe(410);
    expect(errorOf(res).message).toMatch(/expired/);
  });

  it('is rate-limited per client address (429 above the limit)', async () => {
    const limited = createApp({
      db: testDb(),
      env: { ...loadEnv(), PHASELOOM_PUBLIC_URL: PUBLIC_URL },
      logger: pino({ level: 'silent' }),
      services: createServices(testDb()),
      rateLimits: GENEROUS_LIMITS,
      sharedRateLimit: { windowMs: 60_000, limit: 3 },
    });
    const guess = Buffer.alloc(32, 9).toString('base64url');
    const codes: number[] = [];
    for (let i = 0; i < 4; i++) codes.push((await request(limited).get(`/api/shared/${guess}`)).status);
    expect(codes).toEqual([404, 404, 404, 429]);
  });
});

describe('GET /api/benches/:benchId/share-links', () => {
  it('lists the bench links with state and target, never a token or its hash; viewer 403, outsider 404', async () => {
    const res = await owner.agent.get(`/api/benches/${benchId}/share-links`);
    expect(res.status).toBe(200);
    expect(res.body.shareLinks.length).toBeGreaterThan(3);
    const states = new Set(res.body.shareLinks.map((l: { state: string }) => l.state));
    expect(states).toEqual(new Set(['active', 'revoked', 'expired']));
    for (const l of res.body.shareLinks) {
      expect(Object.keys(l).sort()).toEqual(['createdAt', 'createdByName', 'expiresAt', 'id', 'kind', 'revokedAt', 'state', 'targetId', 'targetLabel']);
    }
    expect(res.body.shareLinks.find((l: { kind: string }) => l.kind === 'overlay').targetLabel).toBe('Shared comparison');
    expect((await analyst.agent.get(`/api/benches/${benchId}/share-links`)).status).toBe(200);
    expect((await viewer.agent.get(`/api/benches/${benchId}/share-links`)).status).toBe(403);
    expect((await outsider.agent.get(`/api/benches/${benchId}/share-links`)).status).toBe(404);
  });
});
