/**
 * POST /api/laser-estimates: Henry's worked example through the API (METHODS 6.1, check 14 of METHODS 9),
 * the facet-power convention, signed-in users only, and bad inputs answered 400 with the field named.
 */
import type { Express } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { agent, closeTestDb, errorOf, makeTestApp, signUp, type SignedIn } from '../helpers/api-app';

let app: Express;
let user: SignedIn;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

// METHODS 6.1 [N]: λ = 1550 nm, n_g = 3.6, α_i = 10 /cm, α_m = 30.1 /cm, n_sp = 2, α = 4
const HENRY = { wavelengthNm: 1550, groupIndex: 3.6, internalLossPerCm: 10, nsp: 2, alphaFactor: 4 };

beforeAll(async () => {
  app = makeTestApp().app;
  user = await signUp(app, 'estimator');
});

afterAll(async () => {
  await closeTestDb();
});

describe('POST /api/laser-estimates (C. H. Henry, IEEE J. Quantum Electron. QE-18(2), 259-264 (1982); METHODS 6.1 worked example)', () => {
  it('α_m = 30.1 /cm, 1 mW per facet (symmetric facets): Δν_c = 53.15 GHz, η₀ = 0.751, Δν = 14.51 MHz; 10 mW per facet → 1.451 MHz', async () => {
    const one = await user.agent.post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, mirrorLossPerCm: 30.1, outputPowerMw: 1 });
    expect(one.status).toBe(200);
    expect(rel(one.body.enhancedLinewidthHz, 14.51e6)).toBeLessThan(1e-3);
    expect(rel(one.body.coldCavityLinewidthHz, 53.15e9)).toBeLessThan(1e-3);
    expect(one.body.opticalEfficiency).toBeCloseTo(0.751, 3);
    // outputPowerMw is the power out of facet 1; equal facets carry half of P_out each → P_out = 2 mW
    expect(one.body.outputFacetShare).toBe(0.5);
    expect(one.body.totalOutputPowerMw).toBeCloseTo(2, 12);
    // Schawlow–Townes is Henry's value without the (1 + α²) = 17
    expect(one.body.schawlowTownesLinewidthHz * 17).toBeCloseTo(one.body.enhancedLinewidthHz, 3);
    const ten = await user.agent.post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, mirrorLossPerCm: 30.1, outputPowerMw: 10 });
    expect(rel(ten.body.enhancedLinewidthHz, 1.451e6)).toBeLessThan(1e-3);
    expect(ten.body.linewidthPowerProductHzW).toBeCloseTo(one.body.linewidthPowerProductHzW, 6);
  });

  it('the same laser by its facets: R₁ = R₂ = 0.3 over 400 µm gives α_m = ln(1/0.3)/0.04 cm = 30.10 /cm and 14.51 MHz at 1 mW per facet', async () => {
    const res = await user.agent.post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, facetReflectivities: [0.3, 0.3], outputPowerMw: 1 });
    expect(res.status).toBe(200);
    expect(res.body.mirrorLossPerCm).toBeCloseTo(Math.log(1 / 0.3) / 0.04, 10);
    expect(rel(res.body.enhancedLinewidthHz, 14.51e6)).toBeLessThan(1e-3);
  });

  it('says what is from memory (METHODS 6.1) beside the figures', async () => {
    const res = await user.agent.post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, mirrorLossPerCm: 30.1, outputPowerMw: 1 });
    expect(res.body.fromMemory.join(' ')).toMatch(/from memory/);
    expect(res.body.assumptions.length).toBeGreaterThan(0);
  });

  it('401 without a session', async () => {
    const res = await agent(app).post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, mirrorLossPerCm: 30.1, outputPowerMw: 1 });
    expect(res.status).toBe(401);
  });

  it.each([
    ['a reflectivity above 1', { facetReflectivities: [0.3, 1.2] }, 'facetReflectivities.1'],
    ['a reflectivity of 0', { facetReflectivities: [0, 0.3] }, 'facetReflectivities.0'],
    ['a reflectivity of 1 (no output)', { facetReflectivities: [1, 0.3] }, 'facetReflectivities.0'],
    ['both reflectivities and mirror loss', { facetReflectivities: [0.3, 0.3], mirrorLossPerCm: 30 }, 'facetReflectivities'],
    ['n_sp below 1', { facetReflectivities: [0.3, 0.3], nsp: 0.5 }, 'nsp'],
    ['a group index below 1', { facetReflectivities: [0.3, 0.3], groupIndex: 0.9 }, 'groupIndex'],
    ['a negative output power', { facetReflectivities: [0.3, 0.3], outputPowerMw: -1 }, 'outputPowerMw'],
  ])('400 for %s, naming the field', async (_what, change, path) => {
    const res = await user.agent.post('/api/laser-estimates').send({ ...HENRY, cavityLengthUm: 400, outputPowerMw: 1, ...change });
    expect(res.status).toBe(400);
    expect(errorOf(res).details?.map((d) => d.path)).toContain(path);
  });
});
