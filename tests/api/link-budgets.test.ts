/**
 * Link-budget routes: evaluate from linewidths and from analysed spectra on the bench, the published
 * tolerances and carrier-recovery closed forms through the API (sources named beside each check), saved
 * budgets for every role, 404 for other benches, and bad inputs answered 4xx with the field named and
 * nothing stored.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
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
  testDb,
  type Agent,
  type SignedIn,
} from '../helpers/api-app';
import { iqCapture } from '../helpers/api-captures';
import { startAppWithJobs } from '../helpers/api-jobs';

const baseEnv = loadEnv();
const storage = new LocalDiskStorage(baseEnv.storageDir);
const rel = (a: number, b: number) => Math.abs(a / b - 1);


const FS = 100_000;
const IQ_FIELDS = { kind: 'iq', sampleRateHz: String(FS), format: 'raw', dtype: 'float32', channels: '2' };

async function uploadAndAnalyse(a: Agent, benchId: string, file: Buffer, name: string): Promise<{ analysisId: string; intrinsicLinewidthHz: number }> {
  let req = a.post(`/api/benches/${benchId}/captures`);
  for (const [k, v] of Object.entries(IQ_FIELDS)) req = req.field(k, v);
  const res = await req.attach('file', file, name);
  if (res.status !== 201) throw new Error(`upload: ${res.status} ${res.text}`);
  const id = res.body.analysis.id as string;
  const end = Date.now() + 60_000;
  for (;;) {
    const got = await a.get(`/api/analyses/${id}`);
    if (got.body.status === 'done') return { analysisId: id, intrinsicLinewidthHz: got.body.intrinsicLinewidthHz };
    if (got.body.status === 'failed') throw new Error(`analysis failed: ${got.body.error}`);
    if (Date.now() > end) throw new Error('analysis did not finish');
    await new Promise((r) => setTimeout(r, 50));
  }
}

let app: Express;
let jobs: AnalysisJobs;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let otherBenchId: string;
let spectrum: { analysisId: string; intrinsicLinewidthHz: number };
let otherSpectrum: { analysisId: string; intrinsicLinewidthHz: number };

const budgetsOnBench = async (id: string) => Number((await testDb()('link_budgets').where({ bench_id: id }).count({ n: '*' }))[0].n);

beforeAll(async () => {
  ({ app, jobs } = await startAppWithJobs('link-budgets.test', storage));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Budget bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
  otherBenchId = await createBench(owner, 'Second bench');
  spectrum = await uploadAndAnalyse(analyst.agent, benchId, iqCapture(200_000, FS, 100, 3), 'tx.f32');
  otherSpectrum = await uploadAndAnalyse(owner.agent, otherBenchId, iqCapture(200_000, FS, 300, 5), 'other.f32');
}, 120_000);

afterAll(async () => {
  await jobs?.stop();
  await closeTestDb();
});

describe('POST /api/link-budgets/evaluate — published tolerances (Pfau, Hoffmann, Noé, J. Lightwave Technol. 27(8), 989-999 (2009); METHODS 7.2)', () => {
  it('QPSK at 32 GBd: the tolerance Δν·T_s = 4.1e-4 is 13.1 MHz summed linewidth — 13.1 MHz passes, 13.2 MHz fails', async () => {
    const at = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 13.1e6 });
    expect(at.status).toBe(200);
    expect(at.body).toMatchObject({ format: 'QPSK', combinedLinewidthHz: 13.1e6, toleranceProduct: 4.1e-4, pass: true, linewidthBasis: 'lorentzian-sum' });
    expect(at.body.toleranceSource).toMatch(/Pfau, Hoffmann, No/);
    expect(at.body.toleranceSource).toMatch(/27\(8\), 989-999 \(2009\)/);
    expect(at.body.linewidthSymbolProduct).toBeCloseTo(13.1e6 / 32e9, 15);
    // 4.1e-4 × 32e9 = 13.12 MHz: the published limit expressed as a linewidth
    expect(at.body.toleranceProduct * 32e9).toBeCloseTo(13.12e6, -3);
    expect(at.body.marginFactor).toBeCloseTo(4.1e-4 / (13.1e6 / 32e9), 12);
    expect(at.body.marginDb).toBeCloseTo(10 * Math.log10(at.body.marginFactor), 12);
    const over = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 13.2e6 });
    expect(over.body.pass).toBe(false);
    expect(over.body.marginDb).toBeLessThan(0);
  });

  it('16QAM at 32 GBd, 200 kHz: Δν·T_s = 6.25e-6, margin ×22.4 (13.50 dB), pass — and 4.48 MHz is the 1.4e-4 limit', async () => {
    const res = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: '16QAM', symbolRateBaud: 32e9, linewidthHz: 200e3 });
    expect(res.body.linewidthSymbolProduct).toBeCloseTo(6.25e-6, 15);
    expect(res.body.toleranceProduct).toBe(1.4e-4);
    expect(res.body.marginFactor).toBeCloseTo(22.4, 10);
    expect(res.body.marginDb).toBeCloseTo(13.502, 3);
    expect(res.body.pass).toBe(true);
    expect(res.body.toleranceProduct * 32e9).toBeCloseTo(4.48e6, -3);
    const limit64 = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: '64QAM', symbolRateBaud: 32e9, linewidthHz: 1.28e6 });
    expect(limit64.body.toleranceProduct).toBe(4.0e-5);
    expect(limit64.body.marginFactor).toBeCloseTo(1, 12);
  });

  it('8PSK and 32QAM have no verified published tolerance (METHODS 7.2, 10): tolerance, margin and pass are null and the source says so', async () => {
    for (const format of ['8PSK', '32QAM']) {
      const res = await viewer.agent.post('/api/link-budgets/evaluate').send({ format, symbolRateBaud: 32e9, linewidthHz: 100e3 });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ toleranceProduct: null, marginFactor: null, marginDb: null, pass: null, toleranceCriterion: null });
      expect(res.body.toleranceSource).toMatch(/no published tolerance verified/);
    }
  });

  it('transmitter and local oscillator linewidths add (Lorentzian FWHMs, METHODS 4.1/7.1), and every verdict carries the caution', async () => {
    const res = await viewer.agent
      .post('/api/link-budgets/evaluate')
      .send({ format: 'QPSK', symbolRateBaud: 32e9, transmitter: { linewidthHz: 60e3 }, localOscillator: { linewidthHz: 40e3 } });
    expect(res.body.combinedLinewidthHz).toBe(100e3);
    // σ_p² = 2πΔνT_s: Δν = 100 kHz, R_s = 32 GBd → 1.963e-5 rad² (METHODS 7.1)
    expect(res.body.phaseIncrementVarianceRad2).toBeCloseTo(1.963e-5, 8);
    expect(res.body.caution).toMatch(/estimate/);
    expect(res.body.caution).toMatch(/confirm it on the link/);
    expect(res.body.caution).toMatch(/licensed/);
  });

  it('the table across symbol rates: default 8 … 128 GBd, Δν·T_s proportional to 1/R_s; a given list is followed', async () => {
    const res = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 1e6 });
    expect(res.body.table.map((r: { symbolRateBaud: number }) => r.symbolRateBaud)).toEqual([8e9, 16e9, 32e9, 64e9, 96e9, 128e9]);
    for (const row of res.body.table) expect(row.linewidthSymbolProduct).toBeCloseTo(1e6 / row.symbolRateBaud, 15);
    const given = await viewer.agent.post('/api/link-budgets/evaluate').send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 1e6, tableSymbolRatesBaud: [10e9, 20e9] });
    expect(given.body.table).toHaveLength(2);
  });
});

describe('POST /api/link-budgets/evaluate — residual phase error after carrier recovery (METHODS 7.3 closed forms)', () => {
  it('block average M = 21, Δν = 100 kHz, 32 GBd: σ_e² = σ_p² L(L+1)/(3(2L+1)) = 3.4283e-5 rad²', async () => {
    const res = await viewer.agent
      .post('/api/link-budgets/evaluate')
      .send({ format: '16QAM', symbolRateBaud: 32e9, linewidthHz: 100e3, carrierRecovery: { kind: 'block-average', blockLength: 21 } });
    expect(res.status).toBe(200);
    expect(rel(res.body.residualPhaseErrorRad2, 3.4283e-5)).toBeLessThan(1e-4);
    expect(rel(res.body.equivalentWienerLinewidthHz, 100e3)).toBeLessThan(1e-6);
  });

  it('first-order loop f_c = 100 MHz, h₀ = 1e5/π: σ_e² = πh₀/(2f_c) = 5.0000e-4 rad²', async () => {
    const res = await viewer.agent
      .post('/api/link-budgets/evaluate')
      .send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 100e3, carrierRecovery: { kind: 'first-order-loop', bandwidthHz: 100e6 } });
    expect(rel(res.body.residualPhaseErrorRad2, 5e-4)).toBeLessThan(1e-4);
  });

  it('a transmitter given as a spectrum on the bench: σ_e² from its measured S_ν agrees with the closed form at its own white floor (Δν_eq = π·S_ν,white)', async () => {
    const res = await analyst.agent.post('/api/link-budgets/evaluate').send({
      format: '16QAM',
      symbolRateBaud: 32e9,
      transmitter: { analysisId: spectrum.analysisId },
      localOscillator: { linewidthHz: 0 },
      carrierRecovery: { kind: 'block-average', blockLength: 21 },
    });
    expect(res.status).toBe(200);
    expect(res.body.linewidthBasis).toBe('equivalent-wiener');
    const dnu = spectrum.intrinsicLinewidthHz; // the analysis's π·S_ν,white
    expect(rel(res.body.combinedLinewidthHz, dnu)).toBeLessThan(0.02);
    const L = 10;
    const closed = ((2 * Math.PI * dnu) / 32e9) * ((L * (L + 1)) / (3 * (2 * L + 1)));
    expect(rel(res.body.residualPhaseErrorRad2, closed)).toBeLessThan(0.02);
  });
});

describe('POST /api/link-budgets/evaluate — refused inputs', () => {
  it('401 without a session', async () => {
    const res = await agent(app).post('/api/link-budgets/evaluate').send({ format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 1e5 });
    expect(res.status).toBe(401);
  });

  it.each([
    ['a negative symbol rate', { format: 'QPSK', symbolRateBaud: -32e9, linewidthHz: 1e5 }, 'symbolRateBaud'],
    ['an unknown format', { format: '128APSK', symbolRateBaud: 32e9, linewidthHz: 1e5 }, 'format'],
    ['a negative linewidth', { format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: -1 }, 'linewidthHz'],
    ['neither linewidth nor lasers', { format: 'QPSK', symbolRateBaud: 32e9 }, 'linewidthHz'],
    ['an even block length', { format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 1e5, carrierRecovery: { kind: 'block-average', blockLength: 20 } }, 'carrierRecovery.blockLength'],
    ['a spectrum without carrier recovery', { format: 'QPSK', symbolRateBaud: 32e9, transmitter: { analysisId: 'a'.repeat(24) }, localOscillator: { linewidthHz: 0 } }, 'carrierRecovery'],
  ])('400 for %s, naming the field', async (_what, body, path) => {
    const res = await viewer.agent.post('/api/link-budgets/evaluate').send(body);
    expect(res.status).toBe(400);
    const error = errorOf(res);
    expect(error.code).toBe('validation_failed');
    expect(error.details?.map((d) => d.path)).toContain(path);
  });

  it('404 naming the field for an analysis on a bench the caller is not a member of', async () => {
    const res = await outsider.agent.post('/api/link-budgets/evaluate').send({
      format: 'QPSK',
      symbolRateBaud: 32e9,
      transmitter: { analysisId: spectrum.analysisId },
      localOscillator: { linewidthHz: 0 },
      carrierRecovery: { kind: 'block-average', blockLength: 21 },
    });
    expect(res.status).toBe(404);
    expect(errorOf(res).details?.[0].path).toBe('transmitter.analysisId');
  });
});

describe('saved link budgets: /api/benches/:benchId/link-budgets and /api/link-budgets/:id', () => {
  const input = { format: 'QPSK', symbolRateBaud: 32e9, linewidthHz: 2e6 };
  let analystBudgetId: string;

  it('POST: analysts and owners save (201, evaluated as it is saved); viewers 403; outsiders 404; nothing stored for them', async () => {
    const before = await budgetsOnBench(benchId);
    const a = await analyst.agent.post(`/api/benches/${benchId}/link-budgets`).send({ name: 'Kestrel pair at 32 GBd', input });
    expect(a.status).toBe(201);
    expect(a.body.linkBudget).toMatchObject({ benchId, name: 'Kestrel pair at 32 GBd', createdBy: analyst.user.id, input });
    expect(a.body.linkBudget.result.combinedLinewidthHz).toBe(2e6);
    expect(a.body.linkBudget.result.table).toHaveLength(6);
    analystBudgetId = a.body.linkBudget.id;
    const o = await owner.agent.post(`/api/benches/${benchId}/link-budgets`).send({
      name: 'Measured transmitter',
      input: { format: '16QAM', symbolRateBaud: 64e9, transmitter: { analysisId: spectrum.analysisId }, localOscillator: { linewidthHz: 50e3 }, carrierRecovery: { kind: 'first-order-loop', bandwidthHz: 200e6 } },
    });
    expect(o.status).toBe(201);
    expect(o.body.linkBudget.result.residualPhaseErrorRad2).toBeGreaterThan(0);
    expect((await viewer.agent.post(`/api/benches/${benchId}/link-budgets`).send({ name: 'x', input })).status).toBe(403);
    expect((await outsider.agent.post(`/api/benches/${benchId}/link-budgets`).send({ name: 'x', input })).status).toBe(404);
    expect(await budgetsOnBench(benchId)).toBe(before + 2);
  });

  it('POST refuses bad inputs with the field named and stores nothing: negative symbol rate, unknown format, an analysis from another bench', async () => {
    const before = await budgetsOnBench(benchId);
    const neg = await owner.agent.post(`/api/benches/${benchId}/link-budgets`).send({ name: 'bad', input: { ...input, symbolRateBaud: -1 } });
    expect(neg.status).toBe(400);
    expect(errorOf(neg).details?.map((d) => d.path)).toContain('input.symbolRateBaud');
    const fmt = await owner.agent.post(`/api/benches/${benchId}/link-budgets`).send({ name: 'bad', input: { ...input, format: 'OOK' } });
    expect(fmt.status).toBe(400);
    expect(errorOf(fmt).details?.map((d) => d.path)).toContain('input.format');
    // the owner is a member of both benches, yet a budget uses spectra of its own bench only
    const other = await owner.agent.post(`/api/benches/${benchId}/link-budgets`).send({
      name: 'bad',
      input: { format: 'QPSK', symbolRateBaud: 32e9, transmitter: { analysisId: otherSpectrum.analysisId }, localOscillator: { linewidthHz: 0 }, carrierRecovery: { kind: 'block-average', blockLength: 11 } },
    });
    expect(other.status).toBe(400);
    expect(errorOf(other).details?.[0].path).toBe('transmitter.analysisId');
    expect(await budgetsOnBench(benchId)).toBe(before);
  });

  it('GET list and one: every member (newest first); outsiders 404', async () => {
    const list = await viewer.agent.get(`/api/benches/${benchId}/link-budgets`);
    expect(list.status).toBe(200);
    expect(list.body.linkBudgets.map((b: { name: string }) => b.name)).toEqual(['Measured transmitter', 'Kestrel pair at 32 GBd']);
    expect((await outsider.agent.get(`/api/benches/${benchId}/link-budgets`)).status).toBe(404);
    const one = await viewer.agent.get(`/api/link-budgets/${analystBudgetId}`);
    expect(one.status).toBe(200);
    expect(one.body.linkBudget.createdByName).toBe('analyst');
    expect((await outsider.agent.get(`/api/link-budgets/${analystBudgetId}`)).status).toBe(404);
    expect((await viewer.agent.get('/api/link-budgets/not-an-id')).status).toBe(404);
  });

  it('DELETE: the analyst who saved it or an owner (204); a viewer 403; another analyst’s budget 403; outsiders 404', async () => {
    const ownerBudget = (await viewer.agent.get(`/api/benches/${benchId}/link-budgets`)).body.linkBudgets.find((b: { name: string }) => b.name === 'Measured transmitter').id;
    expect((await viewer.agent.delete(`/api/link-budgets/${analystBudgetId}`)).status).toBe(403);
    expect((await outsider.agent.delete(`/api/link-budgets/${analystBudgetId}`)).status).toBe(404);
    expect((await analyst.agent.delete(`/api/link-budgets/${ownerBudget}`)).status).toBe(403);
    expect((await analyst.agent.delete(`/api/link-budgets/${analystBudgetId}`)).status).toBe(204);
    expect((await owner.agent.delete(`/api/link-budgets/${ownerBudget}`)).status).toBe(204);
    expect((await viewer.agent.get(`/api/link-budgets/${analystBudgetId}`)).status).toBe(404);
    expect(await budgetsOnBench(benchId)).toBe(0);
  });
});
