/**
 * GET /api/analyses/:id/allan with the real job runner: a synthetic white-frequency-noise capture
 * (one-sided S_ν = h0 = 100 Hz²/Hz, fs = 10 kHz) against the power-law relation σ_y²(τ) = h0^(y)/(2τ),
 * h0^(y) = h0/ν0² (IEEE Std 1139-2008; W. J. Riley, "Handbook of Frequency Stability Analysis", NIST SP
 * 1065 (2008); Phaseloom METHODS 5.2): within the reported interval, white FM read from the slope; in Hz
 * without an optical frequency. The bounded frequency record (pair averaging) leaves the deviation at
 * the τ it keeps unchanged (exact, to rounding). Every role; not-done analyses answered 409.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { allanDeviation } from '../../analysis/noise/allan';
import { loadEnv } from '../../server/config/env';
import { AllanResponse } from '../../server/contracts/stability';
import type { AnalysisJobs } from '../../server/jobs/analysis-jobs';
import { readFrequencyRecord } from '../../server/modules/stability/frequency-record';
import { LocalDiskStorage } from '../../server/storage/local-disk-storage';
import { addMember, closeTestDb, createBench, errorOf, signUp, testDb, type Agent, type SignedIn } from '../helpers/api-app';
import { startAppWithJobs } from '../helpers/api-jobs';

const baseEnv = loadEnv();
const storage = new LocalDiskStorage(baseEnv.storageDir);

const FS = 10_000;
const H0 = 100; // Hz²/Hz, one-sided
const N = 2 ** 17;
/** c / 1550.12 nm, as the lasers service stores it (THz, exact c) */
const NU0 = 299_792_458 / 1550.12e-9;

/** White frequency noise ν_i [Hz], variance h0·fs/2 (one-sided h0), float64 little-endian, deterministic. */
function whiteFm(samples: number, seed: number): Float64Array {
  let s = seed >>> 0 || 1;
  const uniform = () => {
    s ^= s << 13;
    s ^= s >>> 17;
    s ^= s << 5;
    return ((s >>> 0) + 0.5) / 4294967296;
  };
  const sigma = Math.sqrt((H0 * FS) / 2);
  const out = new Float64Array(samples);
  for (let i = 0; i < samples; i++) out[i] = 1.5e3 + sigma * Math.sqrt(-2 * Math.log(uniform())) * Math.cos(2 * Math.PI * uniform());
  return out;
}

const FIELDS = { kind: 'frequency', sampleRateHz: String(FS), format: 'raw', dtype: 'float64', channels: '1' };

let app: Express;
let jobs: AnalysisJobs;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let withLaser: string;
let withoutLaser: string;
const record = whiteFm(N, 11);

async function settled(a: Agent, id: string) {
  const end = Date.now() + 60_000;
  for (;;) {
    const res = await a.get(`/api/analyses/${id}`);
    if (res.body.status === 'done' || res.body.status === 'failed') return res.body;
    if (Date.now() > end) throw new Error(`analysis ${id} still ${res.body.status}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

async function uploadCapture(a: Agent, fields: Record<string, string>, name: string): Promise<string> {
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  const res = await req.attach('file', Buffer.from(record.buffer), name);
  if (res.status !== 201) throw new Error(`upload: ${res.status} ${res.text}`);
  const done = await settled(a, res.body.analysis.id);
  if (done.status !== 'done') throw new Error(`analysis failed: ${done.error}`);
  return res.body.analysis.id;
}

beforeAll(async () => {
  ({ app, jobs } = await startAppWithJobs('stability.test', storage));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Stability bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  const laser = await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name: 'Kestrel ECL-1550', type: 'external-cavity', wavelengthNm: 1550.12 });
  withLaser = await uploadCapture(analyst.agent, { ...FIELDS, laserId: laser.body.laser.id }, 'kestrel-frequency.f64');
  withoutLaser = await uploadCapture(analyst.agent, FIELDS, 'unlabelled-frequency.f64');
}, 120_000);

afterAll(async () => {
  await jobs?.stop();
  await closeTestDb();
});

describe('GET /api/analyses/:id/allan', () => {
  it('white FM with the laser ν0: σ_y(τ) = √(h0/(2τ))/ν0 within the reported interval, octave τ, white FM read off the slope', async () => {
    const res = await viewer.agent.get(`/api/analyses/${withLaser}/allan`);
    expect(res.status).toBe(200);
    const body = AllanResponse.parse(res.body);
    expect(body).toMatchObject({ analysisId: withLaser, basis: 'fractional', estimator: 'overlapping', decimation: 1, sampleIntervalS: 1 / FS });
    expect(body.nu0Hz! / NU0 - 1).toBeCloseTo(0, 9);
    expect(body.points.map((p) => p.tauS / body.points[0].tauS)).toEqual(body.points.map((_, i) => 2 ** i));
    expect(body.points.length).toBeGreaterThanOrEqual(15);
    let inside = 0;
    for (const p of body.points) {
      const expected = Math.sqrt(H0 / (2 * p.tauS)) / body.nu0Hz!; // NIST SP 1065 / IEEE 1139: σ_y² = h0^(y)/(2τ)
      expect(p.lower).toBeLessThan(p.deviation);
      expect(p.upper).toBeGreaterThan(p.deviation);
      if (expected >= p.lower && expected <= p.upper) inside++;
      // never beyond three times the 1σ half-width
      expect(expected).toBeGreaterThan(p.deviation - 3 * (p.deviation - p.lower));
      expect(expected).toBeLessThan(p.deviation + 3 * (p.upper - p.deviation));
    }
    // a 68.3 % interval holds the true value at most τ
    expect(inside / body.points.length).toBeGreaterThan(0.5);
    // short τ, many terms: within 2 %
    expect(body.points[0].deviation / (Math.sqrt(H0 / (2e-4)) / body.nu0Hz!) - 1).toBeLessThan(0.02);
    const whiteFm = body.points.slice(1, 10).filter((p) => p.slopeClass === 'white-fm').length;
    expect(whiteFm).toBeGreaterThanOrEqual(8);
    expect(body.regions[0]).toMatchObject({ slopeClass: 'white-fm', referenceSlope: -0.5 });
  });

  it('without an optical frequency it is the Allan deviation of the frequency in Hz, and says so', async () => {
    const res = await owner.agent.get(`/api/analyses/${withoutLaser}/allan`);
    expect(res.status).toBe(200);
    const body = AllanResponse.parse(res.body);
    expect(body.basis).toBe('hz');
    expect(body.nu0Hz).toBeUndefined();
    expect(body.warnings.join(' ')).toMatch(/in Hz, not of the fractional frequency/);
    // the same record: σ_ν = ν0·σ_y, point by point
    const fractional = AllanResponse.parse((await owner.agent.get(`/api/analyses/${withLaser}/allan`)).body);
    body.points.forEach((p, i) => expect(p.deviation / (fractional.points[i].deviation * fractional.nu0Hz!) - 1).toBeCloseTo(0, 9));
    expect(body.points[0].deviation / Math.sqrt(H0 / 2e-4) - 1).toBeLessThan(0.02);
  });

  it('is kept: a second request answers the same body from analysis_allan', async () => {
    const a = await analyst.agent.get(`/api/analyses/${withLaser}/allan`);
    const row = await testDb()('analysis_allan').where({ analysis_id: withLaser }).first();
    expect(row).toMatchObject({ basis: 'fractional' });
    expect(a.body).toEqual((await viewer.agent.get(`/api/analyses/${withLaser}/allan`)).body);
  });

  it('every member reads it; an outsider, an unknown id and a malformed id get 404; 401 signed out', async () => {
    for (const who of [owner, analyst, viewer]) expect((await who.agent.get(`/api/analyses/${withLaser}/allan`)).status).toBe(200);
    const hidden = await outsider.agent.get(`/api/analyses/${withLaser}/allan`);
    expect(hidden.status).toBe(404);
    expect(errorOf(hidden).message).toBe('no such analysis, or it is not on a bench of yours');
    expect((await owner.agent.get(`/api/analyses/${'a'.repeat(24)}/allan`)).status).toBe(404);
    expect((await owner.agent.get('/api/analyses/nope/allan')).status).toBe(404);
    const { default: request } = await import('supertest');
    expect((await request(app).get(`/api/analyses/${withLaser}/allan`)).status).toBe(401);
  });

  it('answers 409 for an analysis that is not done (failed here)', async () => {
    const created = await analyst.agent.post(`/api/captures/${(await analyst.agent.get(`/api/analyses/${withoutLaser}`)).body.captureId}/analyses`).send({ settings: { segment: 4096 } });
    expect(created.status).toBe(201);
    const id = created.body.analysis.id;
    await settled(analyst.agent, id);
    await testDb()('analyses').where({ id }).update({ status: 'failed', error: 'set failed by stability.test' });
    const res = await viewer.agent.get(`/api/analyses/${id}/allan`);
    expect(res.status).toBe(409);
    expect(errorOf(res).message).toMatch(/failed, so it has no Allan deviation/);
  });
});

describe('readFrequencyRecord (bounded memory)', () => {
  it('pair-averages a long record exactly: the deviation at the τ it keeps equals the full record’s', async () => {
    const bytes = new Uint8Array(record.buffer);
    const source = { kind: 'frequency' as const, format: 'raw' as const, sampleRateHz: FS, dtype: 'float64' as const, channels: 1 as const, byteOrder: null, sizeBytes: bytes.length };
    async function* chunks() {
      for (let i = 0; i < bytes.length; i += 65_536) yield bytes.subarray(i, i + 65_536);
    }
    const full = await readFrequencyRecord(chunks(), source);
    const small = await readFrequencyRecord(chunks(), source, 2 ** 12);
    expect(full).toMatchObject({ decimation: 1, frequencySamples: N });
    expect(small).toMatchObject({ decimation: 2 ** 5, frequencySamples: N, sampleIntervalS: 2 ** 5 / FS });
    expect(small.frequencyHz.length).toBe(2 ** 12);
    const a = allanDeviation({ fractionalFrequency: full.frequencyHz }, { sampleIntervalS: full.sampleIntervalS });
    const b = allanDeviation({ fractionalFrequency: small.frequencyHz }, { sampleIntervalS: small.sampleIntervalS, estimator: 'non-overlapping' });
    // the decimated record is the phase sampled every 32 τ0: its non-overlapping estimate at m is the full
    // record's non-overlapping estimate at 32 m
    const fullNon = allanDeviation({ fractionalFrequency: full.frequencyHz }, { sampleIntervalS: full.sampleIntervalS, estimator: 'non-overlapping' });
    for (const p of b.points.slice(0, 6)) {
      const q = fullNon.points.find((x) => Math.abs(x.tauS / p.tauS - 1) < 1e-12)!;
      expect(p.deviation / q.deviation - 1).toBeCloseTo(0, 9);
    }
    expect(a.points[0].tauS).toBe(1 / FS);
  });
});
