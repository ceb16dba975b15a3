/**
 * Corrections through the API with the real job runner, against METHODS checks:
 *  - 4.1 (beat of two independent lasers, S_ν adds): a beat record of white frequency noise h0 = 1.5e4 Hz²/Hz
 *    (test laser 1e4 + reference 5e3, FWHM π·1.5e4 = 47123.9 Hz); subtracting a reference of linewidth
 *    π·5e3 Hz — or the reference's own analysis — leaves the intrinsic linewidth π·1e4 within 5 %;
 *  - 4.3 (short-delay interferometer as a frequency discriminator): a phase record Δφ(t) = φ(t) − φ(t − τ),
 *    τ = 200 µs, of white FM h0 = 100 Hz²/Hz; dividing by 4 sin²(πfτ) recovers S_ν = h0 within 2 % off the
 *    zeros n/τ, and the bins near the zeros are reported masked.
 * Every role; bad input answered 400 and nothing stored.
 */
import type { Express } from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadEnv } from '../../server/config/env';
import { CorrectionListResponse, CorrectionResponse } from '../../server/contracts/corrections';
import type { AnalysisJobs } from '../../server/jobs/analysis-jobs';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import { addMember, closeTestDb, createBench, errorOf, signUp, testDb, type Agent, type SignedIn } from '../helpers/api-app';
import { startAppWithJobs } from '../helpers/api-jobs';

const baseEnv = loadEnv();
const storage = new LocalDiskStorage(baseEnv.storageDir);
const FS = 100_000;
const N = 2 ** 19;

function gaussian(seed: number): () => number {
  let s = seed >>> 0 || 1;
  const uniform = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
}

/** White frequency noise ν_i [Hz], one-sided level h0 (variance h0·fs/2), as float64 bytes. */
function frequencyRecord(h0: number, seed: number): Buffer {
  const g = gaussian(seed);
  const sigma = Math.sqrt((h0 * FS) / 2);
  const out = new Float64Array(N);
  for (let i = 0; i < N; i++) out[i] = sigma * g();
  return Buffer.from(out.buffer);
}

/** Δφ_n = φ_n − φ_{n−D} [rad] of a white-FM laser (φ_n = 2π Σ ν_k / fs), D = τ·fs samples. */
function discriminatorRecord(h0: number, delaySamples: number, seed: number): Buffer {
  const g = gaussian(seed);
  const sigma = Math.sqrt((h0 * FS) / 2);
  const phi = new Float64Array(N + delaySamples);
  for (let i = 1; i < phi.length; i++) phi[i] = phi[i - 1] + (2 * Math.PI * sigma * g()) / FS;
  const out = new Float64Array(N);
  for (let i = 0; i < N; i++) out[i] = phi[i + delaySamples] - phi[i];
  return Buffer.from(out.buffer);
}

let app: Express;
let jobs: AnalysisJobs;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let beatId: string;
let referenceId: string;
let discriminatorId: string;
const DELAY_S = 200e-6;

async function settled(a: Agent, id: string) {
  const end = Date.now() + 90_000;
  for (;;) {
    const res = await a.get(`/api/analyses/${id}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    if (Date.now() > end) throw new Error(`analysis ${id} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

async function analysed(a: Agent, bench: string, bytes: Buffer, kind: 'frequency' | 'phase', name: string): Promise<string> {
  let req = a.post(`/api/benches/${bench}/captures`);
  for (const [k, v] of Object.entries({ kind, sampleRateHz: String(FS), format: 'raw', dtype: 'float64', channels: '1' })) req = req.field(k, v);
  const res = await req.attach('file', bytes, name);
  if (res.status !== 201) throw new Error(`upload: ${res.status} ${res.text}`);
  const done = await settled(a, res.body.analysis.id);
  if (done.status !== 'done') throw new Error(`analysis failed: ${done.error}`);
  return res.body.analysis.id;
}

async function correctionCount(): Promise<number> {
  const [{ n }] = await testDb()('corrections').whereIn('analysis_id', [beatId, referenceId, discriminatorId]).count({ n: '*' });
  return Number(n);
}

beforeAll(async () => {
  ({ app, jobs } = await startAppWithJobs('corrections.test', storage));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Corrections bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  beatId = await analysed(analyst.agent, benchId, frequencyRecord(1.5e4, 21), 'frequency', 'beat-test-vs-reference.f64');
  referenceId = await analysed(analyst.agent, benchId, frequencyRecord(5e3, 22), 'frequency', 'reference-alone.f64');
  discriminatorId = await analysed(analyst.agent, benchId, discriminatorRecord(100, Math.round(DELAY_S * FS), 23), 'phase', 'mzi-200us.f64');
}, 240_000);

afterAll(async () => {
  await jobs?.stop();
  await closeTestDb();
});

describe('POST /api/analyses/:id/corrections — reference laser (METHODS 4.1)', () => {
  it('the beat reads as π·1.5e4 = 47123.9 Hz; subtracting a reference of π·5e3 Hz leaves π·1e4 within 5 %', async () => {
    const before = (await viewer.agent.get(`/api/analyses/${beatId}`)).body;
    expect(Math.abs(before.intrinsicLinewidthHz / 47123.9 - 1)).toBeLessThan(0.05);
    const res = await analyst.agent.post(`/api/analyses/${beatId}/corrections`).send({ type: 'reference', linewidthHz: Math.PI * 5e3 });
    expect(res.status).toBe(201);
    const { correction } = CorrectionResponse.parse(res.body);
    expect(correction).toMatchObject({ analysisId: beatId, type: 'reference', params: { linewidthHz: Math.PI * 5e3 }, method: 'white-level' });
    expect(correction.before.intrinsicLinewidthHz).toBeCloseTo(before.intrinsicLinewidthHz, 6);
    expect(Math.abs(correction.figures.intrinsicLinewidthHz! / (Math.PI * 1e4) - 1)).toBeLessThan(0.05);
    expect(Math.abs(correction.figures.whiteFloorHz2PerHz! / 1e4 - 1)).toBeLessThan(0.05);
    expect(correction.display.frequencyHz.length).toBeGreaterThan(50);
    // the analysis itself is left as it was
    expect((await viewer.agent.get(`/api/analyses/${beatId}`)).body.intrinsicLinewidthHz).toBe(before.intrinsicLinewidthHz);
  });

  it('with the reference’s own analysis on the bench: π·1e4 within 5 %', async () => {
    const res = await owner.agent.post(`/api/analyses/${beatId}/corrections`).send({ type: 'reference', referenceAnalysisId: referenceId });
    expect(res.status).toBe(201);
    const { correction } = CorrectionResponse.parse(res.body);
    expect(correction.method).toBe('spectrum');
    expect(correction.params).toEqual({ referenceAnalysisId: referenceId });
    expect(Math.abs(correction.figures.intrinsicLinewidthHz! / (Math.PI * 1e4) - 1)).toBeLessThan(0.05);
  });
});

describe('POST /api/analyses/:id/corrections — delay interferometer (METHODS 4.3)', () => {
  it('recovers S_ν = h0 within 2 % off the zeros n/τ and reports the masked bins around them', async () => {
    const res = await analyst.agent.post(`/api/analyses/${discriminatorId}/corrections`).send({ type: 'delay-interferometer', delayS: DELAY_S });
    expect(res.status).toBe(201);
    const { correction } = CorrectionResponse.parse(res.body);
    expect(correction.firstZeroHz).toBeCloseTo(5000, 6);
    expect(correction.maskedCount).toBeGreaterThan(0);
    // 4 sin²(πfτ) < 0.1 ⇔ |fτ − n| < 0.0506: ±253 Hz around 5 kHz, 10 kHz, …, up to fs/2
    for (const zero of [5000, 10000, 25000, 45000]) {
      const range = correction.maskedRangesHz.find(([a, b]) => a <= zero && zero <= b);
      expect(range, `a masked range around ${zero} Hz`).toBeDefined();
      expect(range![0]).toBeGreaterThan(zero - 260);
      expect(range![1]).toBeLessThan(zero + 260);
    }
    // off the zeros, below 0.9/τ: the corrected S_ν averages to h0 = 100 Hz²/Hz
    const f = correction.display.frequencyHz;
    const s = correction.display.frequencyNoiseHz2PerHz;
    const band = f.map((v, i) => [v, s[i]]).filter(([v]) => v >= 300 && v <= 4500);
    expect(band.length).toBeGreaterThan(10);
    const mean = band.reduce((acc, [, v]) => acc + v, 0) / band.length;
    expect(Math.abs(mean / 100 - 1)).toBeLessThan(0.02);
    // and the intrinsic linewidth read from it: π·h0
    expect(Math.abs(correction.figures.intrinsicLinewidthHz! / (Math.PI * 100) - 1)).toBeLessThan(0.05);
    // no display point sits inside a masked range
    for (const v of f) expect(correction.maskedRangesHz.some(([a, b]) => v > a && v < b)).toBe(false);
  });
});

describe('corrections: roles and bad input', () => {
  it('every member lists and reads; an outsider gets 404; a viewer may not create or delete (403)', async () => {
    const made = (await analyst.agent.post(`/api/analyses/${beatId}/corrections`).send({ type: 'reference', linewidthHz: 1e3 })).body.correction;
    for (const who of [owner, analyst, viewer]) {
      const list = await who.agent.get(`/api/analyses/${beatId}/corrections`);
      expect(list.status).toBe(200);
      expect(CorrectionListResponse.parse(list.body).corrections.map((c) => c.id)).toContain(made.id);
      expect((await who.agent.get(`/api/corrections/${made.id}`)).body.correction).toEqual(made);
    }
    expect((await outsider.agent.get(`/api/analyses/${beatId}/corrections`)).status).toBe(404);
    expect((await outsider.agent.get(`/api/corrections/${made.id}`)).status).toBe(404);
    expect((await outsider.agent.post(`/api/analyses/${beatId}/corrections`).send({ type: 'reference', linewidthHz: 1 })).status).toBe(404);
    const refused = await viewer.agent.post(`/api/analyses/${beatId}/corrections`).send({ type: 'nonsense' });
    expect(refused.status).toBe(403); // the role is checked before the body
    expect((await viewer.agent.delete(`/api/corrections/${made.id}`)).status).toBe(403);
    expect((await outsider.agent.delete(`/api/corrections/${made.id}`)).status).toBe(404);
    expect((await analyst.agent.delete(`/api/corrections/${made.id}`)).status).toBe(204);
    expect((await owner.agent.get(`/api/corrections/${made.id}`)).status).toBe(404);
    expect((await request(app).get(`/api/analyses/${beatId}/corrections`)).status).toBe(401);
  });

  it('answers 400 and stores nothing: no reference, both references, a negative delay, an unknown type, a reference on another bench, itself', async () => {
    const count = await correctionCount();
    const post = (body: object) => owner.agent.post(`/api/analyses/${beatId}/corrections`).send(body);
    expect(errorOf(await post({ type: 'reference' })).details).toEqual([
      { path: 'referenceAnalysisId', message: 'give the reference as referenceAnalysisId or as linewidthHz (one of them)' },
    ]);
    expect((await post({ type: 'reference', linewidthHz: 1, referenceAnalysisId: referenceId })).status).toBe(400);
    expect(errorOf(await post({ type: 'delay-interferometer', delayS: -1 })).details!.map((d) => d.path)).toEqual(['delayS']);
    expect((await post({ type: 'phase-lock' })).status).toBe(400);
    const self = await post({ type: 'reference', referenceAnalysisId: beatId });
    expect(errorOf(self).details).toEqual([{ path: 'referenceAnalysisId', message: 'the reference must be another analysis' }]);
    const otherBench = await createBench(owner, 'Elsewhere');
    const foreign = await analysed(owner.agent, otherBench, frequencyRecord(5e3, 24), 'frequency', 'elsewhere.f64');
    const cross = await post({ type: 'reference', referenceAnalysisId: foreign });
    expect(errorOf(cross).details).toEqual([{ path: 'referenceAnalysisId', message: 'no such analysis on this bench' }]);
    // a reference louder than the beat everywhere: nothing left to read
    const louder = await post({ type: 'reference', linewidthHz: Math.PI * 1e6 });
    expect(louder.status).toBe(400);
    expect(errorOf(louder).code).toBe('bad_input');
    expect(await correctionCount()).toBe(count);
  });
});
