/**
 * GET /api/benches/:benchId/lasers/:laserId/sweep?parameter=… — a laser's linewidths against an
 * operating parameter, latest done analysis of each capture; for output power the fit
 * Δν = a/P + Δν₀ in 1/P, checked against Phaseloom METHODS 6.3's worked case (an analytic line:
 * P = 2…20 mW, Δν = 2000 Hz·W / P + 150 kHz → a = 2000 Hz·W, Δν₀ = 150 kHz, r² = 1).
 */
import type { Express } from 'express';
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { newId } from '../../server/lib/ids';
import { insertSpectrum } from '../helpers/api-spectra';
import { addMember, closeTestDb, createBench, errorOf, makeTestApp, signUp, type SignedIn } from '../helpers/api-app';

// ---- rows made in the test: a capture on the bench and a done analysis of it (no engine run) ----

const POWERS_MW = [2, 4, 6, 8, 10, 15, 20];
/** Δν = a/P + Δν₀ with a = 2000 Hz·W, Δν₀ = 150 kHz, P in W */
const law = (a: number, floor: number) => (pMw: number) => a / (pMw * 1e-3) + floor;

let app: Express;
let db: Knex;
let owner: SignedIn;
let viewer: SignedIn;
let outsider: SignedIn;
let benchId: string;
let laserId: string;
let sparseLaserId: string;

beforeAll(async () => {
  ({ app, db } = makeTestApp());
  [owner, viewer, outsider] = await Promise.all([signUp(app, 'owner'), signUp(app, 'viewer'), signUp(app, 'outsider')]);
  benchId = await createBench(owner, 'Sweep bench');
  await addMember(owner, benchId, viewer, 'viewer');
  await createBench(outsider, 'Elsewhere');
  const mk = async (name: string) =>
    (await owner.agent.post(`/api/benches/${benchId}/lasers`).send({ name, type: 'dfb', wavelengthNm: 1549.32 })).body.laser.id as string;
  laserId = await mk('Sweep DFB');
  sparseLaserId = await mk('Sparse DFB');
  const intrinsic = law(2000, 150e3);
  const beta = law(4000, 300e3);
  // captures in a shuffled power order, each with drive current and temperature too
  for (const [i, p] of [10, 2, 20, 6, 15, 4, 8].entries()) {
    const { captureId } = await insertSpectrum(db, benchId, owner.user.id, {
      laserId,
      outputPowerMw: p,
      driveCurrentMa: 50 + 10 * i,
      temperatureC: 25,
      intrinsicHz: 999, // an older done analysis: superseded below
      betaHz: 999,
      finishedAt: new Date(Date.UTC(2026, 10, 2, 0, 0, 0)),
    });
    await insertSpectrum(db, benchId, owner.user.id, { captureId, intrinsicHz: intrinsic(p), betaHz: beta(p), finishedAt: new Date(Date.UTC(2026, 10, 3, 0, 0, i)) });
    await insertSpectrum(db, benchId, owner.user.id, { captureId, status: 'queued' }); // newer but not done: ignored
  }
  // a capture that does not state its power, and one with no done analysis
  await insertSpectrum(db, benchId, owner.user.id, { laserId, driveCurrentMa: 200 });
  await insertSpectrum(db, benchId, owner.user.id, { laserId, outputPowerMw: 30, status: 'failed' });
  // two points only
  for (const p of [5, 10]) await insertSpectrum(db, benchId, owner.user.id, { laserId: sparseLaserId, outputPowerMw: p });
});

afterAll(closeTestDb);

const sweepUrl = (laser: string, parameter: string) => `/api/benches/${benchId}/lasers/${laser}/sweep?parameter=${parameter}`;

describe('GET /api/benches/:benchId/lasers/:laserId/sweep', () => {
  it('fits linewidth against 1/P: slope 2000 Hz·W, floor 150 kHz, r² = 1 (METHODS 6.3 worked check)', async () => {
    const res = await viewer.agent.get(sweepUrl(laserId, 'outputPowerMw'));
    expect(res.status).toBe(200);
    expect(res.body.unit).toBe('mW');
    expect(res.body.points.map((p: { x: number }) => p.x)).toEqual(POWERS_MW);
    expect(res.body.withoutParameter).toBe(1);
    const { intrinsic, beta } = res.body.fits;
    expect(intrinsic.reason).toBeNull();
    expect(intrinsic.fit.slopeHzW).toBeCloseTo(2000, 6);
    expect(intrinsic.fit.floorHz).toBeCloseTo(150e3, 4);
    expect(intrinsic.fit.r2).toBeCloseTo(1, 12);
    expect(intrinsic.fit.points).toBe(7);
    expect(beta.fit.slopeHzW).toBeCloseTo(4000, 6);
    expect(beta.fit.floorHz).toBeCloseTo(300e3, 4);
  });

  it('uses the latest done analysis of each capture (never a superseded or unfinished one)', async () => {
    const res = await owner.agent.get(sweepUrl(laserId, 'outputPowerMw'));
    const at2 = res.body.points.find((p: { x: number }) => p.x === 2);
    expect(at2.intrinsicLinewidthHz).toBeCloseTo(1.15e6, 6);
    expect(res.body.points.some((p: { intrinsicLinewidthHz: number }) => p.intrinsicLinewidthHz === 999)).toBe(false);
  });

  it('gives drive-current points in ascending order with no fit and says why', async () => {
    const res = await owner.agent.get(sweepUrl(laserId, 'driveCurrentMa'));
    expect(res.status).toBe(200);
    expect(res.body.unit).toBe('mA');
    expect(res.body.points.map((p: { x: number }) => p.x)).toEqual([50, 60, 70, 80, 90, 100, 110, 200]);
    expect(res.body.fits.intrinsic.fit).toBeNull();
    expect(res.body.fits.intrinsic.reason).toMatch(/output-power/);
  });

  it('answers temperature sweeps in °C', async () => {
    const res = await owner.agent.get(sweepUrl(laserId, 'temperatureC'));
    expect(res.body.unit).toBe('°C');
    expect(res.body.points).toHaveLength(7);
  });

  it('gives no fit with fewer than 3 points and says so', async () => {
    const res = await owner.agent.get(sweepUrl(sparseLaserId, 'outputPowerMw'));
    expect(res.status).toBe(200);
    expect(res.body.points).toHaveLength(2);
    expect(res.body.fits.intrinsic.fit).toBeNull();
    expect(res.body.fits.intrinsic.reason).toMatch(/at least 3 .* there are 2/);
  });

  it('refuses an unknown parameter (400), an unknown laser (404) and an outsider (404)', async () => {
    const bad = await owner.agent.get(sweepUrl(laserId, 'wavelength'));
    expect(bad.status).toBe(400);
    expect(errorOf(bad).code).toBe('validation_failed');
    expect((await owner.agent.get(`/api/benches/${benchId}/lasers/${laserId}/sweep`)).status).toBe(400);
    expect((await owner.agent.get(sweepUrl(newId(), 'outputPowerMw'))).status).toBe(404);
    expect((await outsider.agent.get(sweepUrl(laserId, 'outputPowerMw'))).status).toBe(404);
  });
});
