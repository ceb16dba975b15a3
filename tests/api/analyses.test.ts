/**
 * Analysis routes with the real job runner and worker threads: an upload is analysed to the engine's
 * own report, the spectrum in four views, the series as CSV, new analyses with other settings,
 * retry of a failed one, a laser's spectra over time — for every role, and 404 for other benches.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { analyzeCapture } from '../../analysis/pipeline';
import { logBinSpectrum } from '../../analysis/spectrum/log-binning';
import { loadEnv } from '../../server/config/env';
import type { AnalysisJobs } from '../../server/jobs/analysis-jobs';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import {
  addMember,
  agent,
  closeTestDb,
  createBench,
  errorOf,
  signUp,
  type Agent,
  type SignedIn,
} from '../helpers/api-app';
import { iqCapture } from '../helpers/api-captures';
import { startAppWithJobs } from '../helpers/api-jobs';

const baseEnv = loadEnv();
const storage = new LocalDiskStorage(baseEnv.storageDir);


const FS = 100_000;
const IQ_FIELDS = { kind: 'iq', sampleRateHz: String(FS), format: 'raw', dtype: 'float32', channels: '2' };
const ENGINE_OPTIONS = { kind: 'iq', sampleRateHz: FS, format: 'raw', dtype: 'float32', channels: 2 } as const;

function upload(a: Agent, benchId: string, file: Buffer, name: string, fields: Record<string, string> = IQ_FIELDS) {
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  return req.attach('file', file, name);
}

let app: Express;
let jobs: AnalysisJobs;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
const bytes = iqCapture(200_000, FS, 100, 3);
let captureId: string;
let analysisId: string;

async function settledAnalysis(a: Agent, id: string, timeoutMs = 60_000) {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const res = await a.get(`/api/analyses/${id}`);
    if (res.status !== 200) throw new Error(`GET analysis: ${res.status} ${res.text}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    if (Date.now() > end) throw new Error(`analysis ${id} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

beforeAll(async () => {
  ({ app, jobs } = await startAppWithJobs('analyses.test', storage));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Analysis bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  const res = await upload(analyst.agent, benchId, bytes, 'kestrel.f32');
  expect(res.status).toBe(201);
  captureId = res.body.capture.id;
  analysisId = res.body.analysis.id;
}, 120_000);

afterAll(async () => {
  await jobs?.stop();
  await closeTestDb();
});

describe('GET /api/analyses/:id', () => {
  it('reaches done in a worker thread with result equal to the engine’s report for the same bytes (the CLI’s field names)', async () => {
    const done = await settledAnalysis(viewer.agent, analysisId);
    expect(done).toMatchObject({ id: analysisId, captureId, benchId, status: 'done', progress: 1, stage: 'done', error: null });
    expect(typeof done.finishedAt).toBe('string');
    const engine = await analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, { ...ENGINE_OPTIONS, fileName: 'kestrel.f32' });
    expect(done.result).toEqual(JSON.parse(JSON.stringify(engine.report)));
    expect(Object.keys(done.result)).toEqual(expect.arrayContaining(['input', 'settings', 'whiteFloor', 'intrinsicLinewidthHz', 'betaLine', 'lineshape', 'noiseModel', 'spurs']));
    expect(done.result.spectrum).toBeUndefined();
    // the figure columns are MariaDB DOUBLEs, which travel as text with 15 significant digits
    const sameFigure = (column: number, exact: number | null) => expect(Math.abs(column - (exact as number))).toBeLessThanOrEqual(1e-13 * Math.abs(exact as number));
    sameFigure(done.intrinsicLinewidthHz, engine.report.intrinsicLinewidthHz);
    sameFigure(done.betaLinewidthHz, engine.report.betaLine.linewidthHz);
    sameFigure(done.lineshapeFwhmHz, engine.report.lineshape.fwhmHz);
    sameFigure(done.whiteFloorHz2PerHz, engine.report.whiteFloor.valueHz2PerHz);
    // white frequency noise h0 = 100 Hz²/Hz: Δν = π·h0 ≈ 314 Hz (loose: one short record)
    expect(done.intrinsicLinewidthHz).toBeGreaterThan(0.8 * Math.PI * 100);
    expect(done.intrinsicLinewidthHz).toBeLessThan(1.25 * Math.PI * 100);
  });

  it('is 404 for a member of another bench, an unknown id and a malformed id; 401 signed out', async () => {
    expect((await outsider.agent.get(`/api/analyses/${analysisId}`)).status).toBe(404);
    expect((await owner.agent.get('/api/analyses/bbbbbbbbbbbbbbbbbbbbbbbb')).status).toBe(404);
    expect((await owner.agent.get('/api/analyses/x')).status).toBe(404);
    expect((await agent(app).get(`/api/analyses/${analysisId}`)).status).toBe(401);
  });
});

describe('GET /api/analyses/:id/spectrum', () => {
  let engine: Awaited<ReturnType<typeof analyzeCapture>>;
  beforeAll(async () => {
    await settledAnalysis(owner.agent, analysisId);
    engine = await analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, ENGINE_OPTIONS);
  });

  it('view=frequency is the engine’s S_ν log-binned to at most N points (default 400)', async () => {
    const res = await viewer.agent.get(`/api/analyses/${analysisId}/spectrum`);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ view: 'frequency', unit: 'Hz²/Hz' });
    expect(res.body.points).toBe(res.body.frequencyHz.length);
    expect(res.body.points).toBeLessThanOrEqual(400);
    expect(res.body.points).toBeGreaterThan(100);
    const expected = logBinSpectrum(engine.spectrum, { points: 399 });
    expect(res.body.points).toBe(expected.frequencyHz.length);
    // 7 significant digits: within 5e-7 relative of the engine's doubles
    const close = (got: number[], want: Float64Array) => got.every((g, i) => Math.abs(g - want[i]) <= 5e-7 * Math.abs(want[i]));
    expect(close(res.body.frequencyHz, expected.frequencyHz)).toBe(true);
    expect(close(res.body.values, expected.psd)).toBe(true);
  });

  it('view=phase is S_ν/f², view=dbc is 10·log10(S_φ/2), view=asd is √S_ν (IEEE Std 1139-2008), point for point', async () => {
    const q = (view: string) => viewer.agent.get(`/api/analyses/${analysisId}/spectrum?view=${view}&points=50`);
    const [nu, phase, dbc, asd] = await Promise.all(['frequency', 'phase', 'dbc', 'asd'].map(q));
    expect([phase.body.unit, dbc.body.unit, asd.body.unit]).toEqual(['rad²/Hz', 'dBc/Hz', 'Hz/√Hz']);
    expect(nu.body.points).toBeLessThanOrEqual(50);
    for (let i = 0; i < nu.body.points; i++) {
      const f = nu.body.frequencyHz[i];
      const s = nu.body.values[i];
      // each view is rounded to 7 significant digits on its own, so compare to about 1e-6 relative
      const near = (got: number, want: number) => expect(Math.abs(got - want)).toBeLessThanOrEqual(1.5e-6 * Math.abs(want));
      expect(phase.body.frequencyHz[i]).toBe(f);
      near(phase.body.values[i], s / (f * f));
      near(dbc.body.values[i], 10 * Math.log10(s / (f * f) / 2));
      near(asd.body.values[i], Math.sqrt(s));
    }
  });

  it('answers 400 for a view or point count outside the contract', async () => {
    expect(errorOf(await viewer.agent.get(`/api/analyses/${analysisId}/spectrum?view=power`)).code).toBe('validation_failed');
    expect((await viewer.agent.get(`/api/analyses/${analysisId}/spectrum?points=5001`)).status).toBe(400);
    expect((await viewer.agent.get(`/api/analyses/${analysisId}/spectrum?points=1`)).status).toBe(400);
    expect((await viewer.agent.get(`/api/analyses/${analysisId}/spectrum?points=5000`)).status).toBe(200);
  });

  it('is 404 for a member of another bench', async () => {
    expect((await outsider.agent.get(`/api/analyses/${analysisId}/spectrum`)).status).toBe(404);
  });

  it('is 404 for a member removed from the bench once the 2 s read grant has lapsed', async () => {
    const leaving = await signUp(app, 'leaving');
    await addMember(owner, benchId, leaving, 'viewer');
    expect((await leaving.agent.get(`/api/analyses/${analysisId}/spectrum`)).status).toBe(200);
    expect((await owner.agent.delete(`/api/benches/${benchId}/members/${leaving.user.id}`)).status).toBe(204);
    await new Promise((r) => setTimeout(r, 2100));
    expect((await leaving.agent.get(`/api/analyses/${analysisId}/spectrum`)).status).toBe(404);
  });
});

describe('GET /api/analyses/:id/series.csv', () => {
  it('is the full stitched spectrum as frequency_hz,s_nu_hz2_per_hz', async () => {
    await settledAnalysis(owner.agent, analysisId);
    const res = await viewer.agent.get(`/api/analyses/${analysisId}/series.csv`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const lines = res.text.trim().split('\n');
    expect(lines[0]).toBe('frequency_hz,s_nu_hz2_per_hz');
    const engine = await analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, ENGINE_OPTIONS);
    expect(lines.length - 1).toBe(engine.spectrum.frequencyHz.length);
    const [f, s] = lines[1].split(',').map(Number);
    expect(f).toBe(engine.spectrum.frequencyHz[0]);
    expect(s).toBe(engine.spectrum.psd[0]);
    expect((await outsider.agent.get(`/api/analyses/${analysisId}/series.csv`)).status).toBe(404);
  });
});

describe('POST /api/captures/:id/analyses', () => {
  it('queues a new analysis with the given settings beside the earlier one, and it runs', async () => {
    const res = await analyst.agent
      .post(`/api/captures/${captureId}/analyses`)
      .send({ settings: { window: 'blackman-harris', segment: 2048, overlap: 0.25, observationTimeS: 0.5 } });
    expect(res.status).toBe(201);
    expect(res.body.analysis).toMatchObject({ captureId, benchId, status: 'queued', settings: { window: 'blackman-harris', segment: 2048 } });
    const done = await settledAnalysis(analyst.agent, res.body.analysis.id);
    expect(done.status).toBe('done');
    expect(done.result.settings).toMatchObject({ window: 'blackman-harris', segment: 2048, overlap: 0.25 });
    expect(done.result.betaLine.observationTimeS).toBe(0.5);
    const detail = await viewer.agent.get(`/api/captures/${captureId}`);
    expect(detail.body.analyses.map((a: { id: string }) => a.id)).toEqual([res.body.analysis.id, analysisId]);
  });

  it('refuses viewers (403) before looking at the body, other benches (404), and bad settings (400)', async () => {
    const v = await viewer.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: { segment: 3 } });
    expect(v.status).toBe(403);
    expect((await outsider.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: {} })).status).toBe(404);
    const bad = await owner.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: { segment: 3, overlap: 1, color: 'red' } });
    expect(bad.status).toBe(400);
    expect(errorOf(bad).details?.map((d) => d.path).sort()).toEqual(['settings', 'settings.overlap', 'settings.segment']);
  });
});

describe('a failed analysis', () => {
  let failedId: string;

  beforeAll(async () => {
    // a floor band above fs/2: the engine refuses it; the job fails with the engine's message
    const res = await analyst.agent.post(`/api/captures/${captureId}/analyses`).send({ settings: { floorBandHz: '200000:300000' } });
    expect(res.status).toBe(201);
    failedId = res.body.analysis.id;
  });

  it('is failed with the engine’s message, and has no spectrum (409)', async () => {
    const failed = await settledAnalysis(viewer.agent, failedId);
    expect(failed.status).toBe('failed');
    let expected = '';
    try {
      await analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, { ...ENGINE_OPTIONS, floorBandHz: [200000, 300000] });
    } catch (e) {
      expected = (e as Error).message;
    }
    expect(expected).not.toBe('');
    expect(failed.error).toBe(expected);
    expect(failed.result).toBeNull();
    expect((await viewer.agent.get(`/api/analyses/${failedId}/spectrum`)).status).toBe(409);
  });

  it('POST /retry puts it back in the queue for analysts and owners; viewers 403, other benches 404, not-failed 409', async () => {
    await settledAnalysis(viewer.agent, failedId);
    expect((await viewer.agent.post(`/api/analyses/${failedId}/retry`)).status).toBe(403);
    expect((await outsider.agent.post(`/api/analyses/${failedId}/retry`)).status).toBe(404);
    const retried = await owner.agent.post(`/api/analyses/${failedId}/retry`);
    expect(retried.status).toBe(200);
    expect(retried.body.analysis).toMatchObject({ id: failedId, status: 'queued', progress: 0, error: null });
    const again = await settledAnalysis(viewer.agent, failedId);
    expect(again.status).toBe('failed'); // the same settings fail the same way
    const done = await analyst.agent.post(`/api/analyses/${analysisId}/retry`);
    expect(done.status).toBe(409);
    expect(errorOf(done).code).toBe('conflict');
  });
});

describe('GET /api/benches/:benchId/lasers/:laserId/spectra', () => {
  it('lists each capture of the laser with its latest done analysis and operating point, oldest first', async () => {
    const laser = await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name: 'Wren DFB-1549', type: 'dfb', wavelengthNm: 1549.32 });
    const laserId = laser.body.laser.id;
    const ids: string[] = [];
    for (const [i, current] of [100, 150].entries()) {
      const res = await upload(analyst.agent, benchId, iqCapture(60_000, FS, 100 * (i + 1), 40 + i), `wren-${current}mA.f32`, {
        ...IQ_FIELDS,
        laserId,
        driveCurrentMa: String(current),
        temperatureC: '22.5',
      });
      expect(res.status).toBe(201);
      ids.push(res.body.analysis.id);
    }
    for (const id of ids) expect((await settledAnalysis(owner.agent, id)).status).toBe('done');
    const res = await viewer.agent.get(`/api/benches/${benchId}/lasers/${laserId}/spectra`);
    expect(res.status).toBe(200);
    expect(res.body.laser).toMatchObject({ id: laserId, name: 'Wren DFB-1549' });
    expect(res.body.points.map((p: { analysisId: string }) => p.analysisId)).toEqual(ids);
    expect(res.body.points.map((p: { driveCurrentMa: number }) => p.driveCurrentMa)).toEqual([100, 150]);
    for (const p of res.body.points) expect(p.intrinsicLinewidthHz).toBeGreaterThan(0);
    expect((await outsider.agent.get(`/api/benches/${benchId}/lasers/${laserId}/spectra`)).status).toBe(404);
    expect((await viewer.agent.get(`/api/benches/${benchId}/lasers/cccccccccccccccccccccccc/spectra`)).status).toBe(404);
  });
});
