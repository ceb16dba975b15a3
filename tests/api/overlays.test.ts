/**
 * Overlay routes for every role: GET/POST /api/benches/:benchId/overlays, GET/PATCH/DELETE
 * /api/overlays/:id — members read, owners and analysts write, viewers 403, other benches 404;
 * analyses of another bench, unknown or unfinished are refused with one message; trace colours follow
 * the Okabe–Ito palette (Okabe & Ito, "Color Universal Design", 2002) by position.
 */
import type { Express } from 'express';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newId } from '../../server/lib/ids';
import { insertSpectrum } from '../helpers/api-spectra';
import { addMember, closeTestDb, createBench, errorOf, makeTestApp, signUp, type SignedIn } from '../helpers/api-app';

// ---- rows made in the test: a capture on the bench and a done analysis of it (no engine run) ----

/** The eight Okabe–Ito colours as the paper gives them (sRGB hex), common practice in plotting. */
const OKABE_ITO = new Set(['#000000', '#E69F00', '#56B4E9', '#009E73', '#F0E442', '#0072B2', '#D55E00', '#CC79A7']);

let app: Express;
let db: Knex;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let otherBenchId: string;
const spectra: string[] = [];
let queuedId: string;
let foreignId: string;

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  [owner, analyst, viewer, outsider] = await Promise.all([signUp(app, 'owner'), signUp(app, 'analyst'), signUp(app, 'viewer'), signUp(app, 'outsider')]);
  benchId = await createBench(owner, 'Overlay bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  otherBenchId = await createBench(outsider, 'Elsewhere');
  const laser = await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name: 'Overlay ECL', type: 'external-cavity', wavelengthNm: 1550.12 });
  for (let i = 0; i < 4; i++) {
    const { analysisId } = await insertSpectrum(db, benchId, owner.user.id, { laserId: i < 2 ? laser.body.laser.id : null, fileName: `trace-${i}.npy`, intrinsicHz: 100 * (i + 1) });
    spectra.push(analysisId);
  }
  queuedId = (await insertSpectrum(db, benchId, owner.user.id, { status: 'queued' })).analysisId;
  foreignId = (await insertSpectrum(db, otherBenchId, outsider.user.id)).analysisId;
});

afterAll(closeTestDb);

describe('POST /api/benches/:benchId/overlays', () => {
  it('creates an overlay with its traces in order, colours from the Okabe–Ito palette by position', async () => {
    const res = await analyst.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Three lasers', analysisIds: [spectra[2], spectra[0], spectra[1]] });
    expect(res.status).toBe(201);
    const o = res.body.overlay;
    expect(o.name).toBe('Three lasers');
    expect(o.benchId).toBe(benchId);
    expect(o.traces.map((t: { analysisId: string }) => t.analysisId)).toEqual([spectra[2], spectra[0], spectra[1]]);
    const colours = o.traces.map((t: { color: string }) => t.color);
    expect(colours).toEqual(['#0072B2', '#D55E00', '#009E73']);
    for (const c of colours) expect(OKABE_ITO.has(c)).toBe(true);
    const t0 = o.traces[0];
    expect(t0.fileName).toBe('trace-2.npy');
    expect(t0.figures).toEqual({ intrinsicLinewidthHz: 300, betaLinewidthHz: 20_000, lineshapeFwhmHz: 25_000, whiteFloorHz2PerHz: 318.3, cornerHz: 94_250 });
    expect(t0.settings).toEqual({ window: 'hann', segment: 4096, overlap: 0.5, averages: 31, observationTimeS: 0.01, floorBandHz: [1e4, 1e5] });
    expect(t0.series.frequencyHz).toHaveLength(4);
    expect(o.traces[1].laserName).toBe('Overlay ECL');
  });

  it('lets the owner create one too; a viewer gets 403 before the body is read', async () => {
    expect((await owner.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Owner', analysisIds: [spectra[0]] })).status).toBe(201);
    const res = await viewer.agent.post(`/api/benches/${benchId}/overlays`).send({});
    expect(res.status).toBe(403);
    expect(errorOf(res).code).toBe('forbidden');
  });

  it('answers an outsider 404 for the bench', async () => {
    const res = await outsider.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'x', analysisIds: [spectra[0]] });
    expect(res.status).toBe(404);
  });

  it('refuses analyses of another bench, unknown or unfinished with the same message', async () => {
    const unknown = newId();
    const res = await analyst.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Bad', analysisIds: [spectra[0], foreignId, unknown, queuedId] });
    expect(res.status).toBe(400);
    const e = errorOf(res);
    expect(e.code).toBe('validation_failed');
    expect(e.details?.map((d) => d.path)).toEqual(['analysisIds.1', 'analysisIds.2', 'analysisIds.3']);
    expect(new Set(e.details?.map((d) => d.message)).size).toBe(1);
    expect(await db('overlays').where({ bench_id: benchId, name: 'Bad' }).first()).toBeUndefined();
  });

  it('refuses an empty name, no spectra, a repeated spectrum and more than eight', async () => {
    const post = (body: object) => analyst.agent.post(`/api/benches/${benchId}/overlays`).send(body);
    expect((await post({ name: ' ', analysisIds: [spectra[0]] })).status).toBe(400);
    expect((await post({ name: 'n', analysisIds: [] })).status).toBe(400);
    expect((await post({ name: 'n', analysisIds: [spectra[0], spectra[0]] })).status).toBe(400);
    expect((await post({ name: 'n', analysisIds: Array.from({ length: 9 }, () => newId()) })).status).toBe(400);
    expect((await post({ name: 'n', analysisIds: ['not-an-id'] })).status).toBe(400);
  });
});

describe('GET /api/benches/:benchId/overlays and GET /api/overlays/:id', () => {
  let overlayId: string;
  beforeAll(async () => {
    const res = await analyst.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Listed', analysisIds: [spectra[0], spectra[3]] });
    overlayId = res.body.overlay.id;
  });

  it('lists the bench overlays with their trace counts for every member', async () => {
    for (const who of [owner, analyst, viewer]) {
      const res = await who.agent.get(`/api/benches/${benchId}/overlays`);
      expect(res.status).toBe(200);
      const listed = res.body.overlays.find((o: { id: string }) => o.id === overlayId);
      expect(listed).toMatchObject({ name: 'Listed', traceCount: 2 });
    }
    expect((await outsider.agent.get(`/api/benches/${benchId}/overlays`)).status).toBe(404);
  });

  it('reads one overlay for every member and 404 for an outsider or an unknown id', async () => {
    for (const who of [owner, analyst, viewer]) expect((await who.agent.get(`/api/overlays/${overlayId}`)).status).toBe(200);
    expect((await outsider.agent.get(`/api/overlays/${overlayId}`)).status).toBe(404);
    expect((await owner.agent.get(`/api/overlays/${newId()}`)).status).toBe(404);
    expect((await owner.agent.get(`/api/overlays/nonsense`)).status).toBe(404);
  });

  it('asks for sign-in without a session', async () => {
    const { default: request } = await import('supertest');
    expect((await request(app).get(`/api/overlays/${overlayId}`)).status).toBe(401);
  });
});

describe('PATCH and DELETE /api/overlays/:id', () => {
  let overlayId: string;
  beforeAll(async () => {
    const res = await analyst.agent.post(`/api/benches/${benchId}/overlays`).send({ name: 'Editable', analysisIds: [spectra[0], spectra[1], spectra[2]] });
    overlayId = res.body.overlay.id;
  });

  it('removes a trace: the remaining traces take the colours of their new positions', async () => {
    const res = await analyst.agent.patch(`/api/overlays/${overlayId}`).send({ analysisIds: [spectra[0], spectra[2]] });
    expect(res.status).toBe(200);
    expect(res.body.overlay.traces.map((t: { analysisId: string; color: string }) => [t.analysisId, t.color])).toEqual([
      [spectra[0], '#0072B2'],
      [spectra[2], '#D55E00'],
    ]);
  });

  it('renames it (owner) and keeps the traces', async () => {
    const res = await owner.agent.patch(`/api/overlays/${overlayId}`).send({ name: 'Renamed' });
    expect(res.status).toBe(200);
    expect(res.body.overlay.name).toBe('Renamed');
    expect(res.body.overlay.traceCount).toBe(2);
  });

  it('refuses a viewer (403), an outsider (404), an empty patch and a foreign analysis (400), changing nothing', async () => {
    expect((await viewer.agent.patch(`/api/overlays/${overlayId}`).send({ name: 'V' })).status).toBe(403);
    expect((await outsider.agent.patch(`/api/overlays/${overlayId}`).send({ name: 'O' })).status).toBe(404);
    expect((await analyst.agent.patch(`/api/overlays/${overlayId}`).send({})).status).toBe(400);
    expect((await analyst.agent.patch(`/api/overlays/${overlayId}`).send({ analysisIds: [foreignId] })).status).toBe(400);
    const after = await owner.agent.get(`/api/overlays/${overlayId}`);
    expect(after.body.overlay.name).toBe('Renamed');
    expect(after.body.overlay.traces).toHaveLength(2);
  });

  it('deletes it: viewer 403, outsider 404, analyst 204, then 404', async () => {
    expect((await viewer.agent.delete(`/api/overlays/${overlayId}`)).status).toBe(403);
    expect((await outsider.agent.delete(`/api/overlays/${overlayId}`)).status).toBe(404);
    expect((await analyst.agent.delete(`/api/overlays/${overlayId}`)).status).toBe(204);
    expect((await owner.agent.get(`/api/overlays/${overlayId}`)).status).toBe(404);
    expect(await db('overlay_traces').where({ overlay_id: overlayId })).toHaveLength(0);
  });
});
