/**
 * Rate-equation simulations through the whole path: POST → worker thread → .npy stored through the captures
 * service (tagged "synthetic") → the ordinary analysis in the job runner's worker → the analysed intrinsic
 * linewidth against the estimator (POST /api/laser-estimates) for the same laser, within 20 %; doubling the
 * spontaneous-emission coupling β_sp raises it. Roles for every route, 404 for other benches, bad inputs
 * answered 400 with the field named and nothing stored. Records are kept short (2^16 samples at 10 GHz,
 * steps of 2 ps) so the runs take seconds.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEFAULT_RATE_EQUATION_PARAMETERS } from '../../analysis/laser/rate-equation-model';
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
import { startAppWithJobs } from '../helpers/api-jobs';

const baseEnv = loadEnv();
const storage = new LocalDiskStorage(baseEnv.storageDir);
const rel = (a: number, b: number) => Math.abs(a / b - 1);

let app: Express;
let jobs: AnalysisJobs;
let owner: SignedIn;
let analyst: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;

const SHORT = { durationS: 65536 / 10e9, sampleRateHz: 10e9, maxStepS: 2e-12 };

async function settle<T>(read: () => Promise<T>, done: (v: T) => boolean, what: string, timeoutMs = 120_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (done(v)) return v;
    if (Date.now() > end) throw new Error(`${what} did not finish: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function simulateAndAnalyse(a: Agent, body: object) {
  const res = await a.post(`/api/benches/${benchId}/simulations`).send(body);
  if (res.status !== 202) throw new Error(`POST simulations: ${res.status} ${res.text}`);
  const sim = await settle(
    async () => (await a.get(`/api/simulations/${res.body.simulation.id}`)).body.simulation,
    (s) => s.status === 'done' || s.status === 'failed',
    'simulation',
  );
  if (sim.status !== 'done') throw new Error(`simulation failed: ${sim.error}`);
  const analysis = await settle(
    async () => (await a.get(`/api/analyses/${sim.analysisId}`)).body,
    (x) => x.status === 'done' || x.status === 'failed',
    'analysis',
  );
  const after = (await a.get(`/api/simulations/${sim.id}`)).body.simulation;
  return { created: res.body.simulation, sim, analysis, after };
}

const countRows = async (table: string) => Number((await testDb()(table).count({ n: '*' }))[0].n);

beforeAll(async () => {
  ({ app, jobs } = await startAppWithJobs('simulations.test', storage));
  owner = await signUp(app, 'owner');
  analyst = await signUp(app, 'analyst');
  viewer = await signUp(app, 'viewer');
  outsider = await signUp(app, 'outsider');
  benchId = await createBench(owner, 'Simulation bench');
  await addMember(owner, benchId, analyst, 'analyst');
  await addMember(owner, benchId, viewer, 'viewer');
}, 60_000);

afterAll(async () => {
  await jobs?.stop();
  await closeTestDb();
});

describe('POST /api/benches/:benchId/simulations → a synthetic capture through the ordinary analysis (METHODS 6.4)', () => {
  it('the analysed intrinsic linewidth agrees with the estimator for the same laser within 20 %; doubling β_sp raises it', async () => {
    const base = await simulateAndAnalyse(analyst.agent, { ...SHORT, seed: 2, name: 'Default laser' });
    expect(base.created).toMatchObject({ status: 'queued', benchId, samples: 65536 });
    expect(base.sim).toMatchObject({ status: 'done', progress: 1 });
    expect(base.analysis.status).toBe('done');
    // the run reports its capture's analysis as it goes, and the figure once done
    expect(base.after.analysis).toEqual({ status: 'done', progress: 1, intrinsicLinewidthHz: base.analysis.intrinsicLinewidthHz });

    // the estimator (Henry, METHODS 6.1) for the same laser: n_sp = R_sp·τ_p, the facet-1 power
    const estimate = await analyst.agent.post('/api/laser-estimates').send(base.sim.prediction.estimatorInput);
    expect(estimate.status).toBe(200);
    // the model's own phase-diffusion prediction R_sp(1+α²)/(4πP) and the estimator are the same formula (METHODS 6.4 [D])
    expect(rel(estimate.body.enhancedLinewidthHz, base.sim.prediction.predictedLinewidthHz)).toBeLessThan(1e-9);
    expect(rel(base.analysis.intrinsicLinewidthHz, estimate.body.enhancedLinewidthHz)).toBeLessThan(0.2);

    const doubled = await simulateAndAnalyse(analyst.agent, {
      ...SHORT,
      seed: 3,
      parameters: { spontaneousCoupling: 2 * DEFAULT_RATE_EQUATION_PARAMETERS.spontaneousCoupling },
    });
    const estimate2 = await analyst.agent.post('/api/laser-estimates').send(doubled.sim.prediction.estimatorInput);
    expect(rel(doubled.analysis.intrinsicLinewidthHz, estimate2.body.enhancedLinewidthHz)).toBeLessThan(0.2);
    expect(estimate2.body.enhancedLinewidthHz / estimate.body.enhancedLinewidthHz).toBeGreaterThan(1.9);
    expect(doubled.analysis.intrinsicLinewidthHz).toBeGreaterThan(1.5 * base.analysis.intrinsicLinewidthHz);
  }, 240_000);

  it('the capture is an ordinary .npy IQ capture on the bench, tagged synthetic, listed with the captures', async () => {
    const list = await viewer.agent.get(`/api/benches/${benchId}/captures?tag=synthetic`);
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(2);
    const capture = list.body.captures[0];
    expect(capture).toMatchObject({ kind: 'iq', format: 'npy', sampleRateHz: 10e9, channels: 2, tags: ['synthetic'], driveCurrentMa: 10 });
    expect(capture.sizeBytes).toBe(128 + 65536 * 8); // a 128-byte .npy header and float32 (N, 2)
    // newest first: the second run, named by default after its current
    expect(capture.fileName).toMatch(/^rate-equation-laser-at-10-ma-seed-3-[a-z2-7]{6}\.npy$/);
    expect(list.body.captures[1].fileName).toMatch(/^default-laser-seed-2-[a-z2-7]{6}\.npy$/);
    expect(capture.latestAnalysis.status).toBe('done');
    const sims = await viewer.agent.get(`/api/benches/${benchId}/simulations`);
    expect(sims.body.simulations.map((s: { captureId: string }) => s.captureId)).toContain(capture.id);
  });
});

describe('simulation routes: roles and refused inputs', () => {
  it('POST: an owner may run one too (202, queued, then done with its capture)', async () => {
    const res = await owner.agent.post(`/api/benches/${benchId}/simulations`).send({ ...SHORT, durationS: 8192 / 10e9, seed: 9 });
    expect(res.status).toBe(202);
    expect(res.body.simulation).toMatchObject({ status: 'queued', progress: 0, captureId: null, createdBy: owner.user.id });
    const done = await settle(
      async () => (await owner.agent.get(`/api/simulations/${res.body.simulation.id}`)).body.simulation,
      (s) => s.status === 'done' || s.status === 'failed',
      'simulation',
    );
    expect(done.status).toBe('done');
    expect(done.captureId).toMatch(/^[a-z2-7]{24}$/);
  });

  it('POST: a viewer 403, an outsider 404, no session 401 — nothing stored', async () => {
    const before = await countRows('simulations');
    expect((await viewer.agent.post(`/api/benches/${benchId}/simulations`).send(SHORT)).status).toBe(403);
    expect((await outsider.agent.post(`/api/benches/${benchId}/simulations`).send(SHORT)).status).toBe(404);
    expect((await agent(app).post(`/api/benches/${benchId}/simulations`).send(SHORT)).status).toBe(401);
    expect(await countRows('simulations')).toBe(before);
  });

  it.each([
    ['too short a record', { ...SHORT, durationS: 1e-9 }, 'durationS'],
    ['a reflectivity outside (0, 1)', { ...SHORT, parameters: { facetReflectivities: [0.32, 1.2] } }, 'parameters.facetReflectivities.1'],
    ['a laser below threshold', { ...SHORT, parameters: { currentMa: 1 } }, 'parameters.currentMa'],
    ['an unknown parameter', { ...SHORT, parameters: { pumpWatts: 3 } }, 'parameters'],
    ['a laser of another bench', { ...SHORT, laserId: 'a'.repeat(24) }, 'laserId'],
  ])('400 for %s, naming the field, and nothing stored', async (_what, body, path) => {
    const sims = await countRows('simulations');
    const captures = await countRows('captures');
    const res = await owner.agent.post(`/api/benches/${benchId}/simulations`).send(body);
    expect(res.status).toBe(400);
    expect(errorOf(res).details?.map((d) => d.path)).toContain(path);
    expect(await countRows('simulations')).toBe(sims);
    expect(await countRows('captures')).toBe(captures);
  });

  it('GET one and the list: every member; outsiders 404', async () => {
    const list = await viewer.agent.get(`/api/benches/${benchId}/simulations`);
    expect(list.status).toBe(200);
    const id = list.body.simulations[0].id;
    expect((await viewer.agent.get(`/api/simulations/${id}`)).status).toBe(200);
    expect((await outsider.agent.get(`/api/simulations/${id}`)).status).toBe(404);
    expect((await outsider.agent.get(`/api/benches/${benchId}/simulations`)).status).toBe(404);
    expect((await agent(app).get(`/api/simulations/${id}`)).status).toBe(401);
  });
});
