import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { cavityFormLinewidthHz, estimateLaserLinewidth, phaseDiffusionLinewidthHz } from '../../analysis/laser/estimator';
import { fitLinewidthPowerSweep } from '../../analysis/laser/power-sweep';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
// METHODS 6.1 worked example: λ = 1550 nm, n_g = 3.6, α_i = 10 /cm, α_m = 30.1 /cm, n_sp = 2, α = 4
const henry = { wavelengthNm: 1550, groupIndex: 3.6, cavityLengthUm: 400, internalLossPerCm: 10, nsp: 2, alphaFactor: 4 };

describe('estimateLaserLinewidth (Henry, IEEE JQE QE-18, 259 (1982); METHODS 6.1)', () => {
  it('mirror loss 30.1 /cm, 1 mW per facet → Δν_c = 53.15 GHz, η₀ = 0.751, Henry linewidth 14.51 MHz (METHODS 6.1 / row 14)', () => {
    const e = estimateLaserLinewidth({ ...henry, mirrorLossPerCm: 30.1, outputPowerMw: 1 });
    expect(rel(e.coldCavityLinewidthHz, 53.15e9)).toBeLessThan(1e-3);
    expect(rel(e.opticalEfficiency, 0.751)).toBeLessThan(1e-3);
    expect(rel(e.enhancedLinewidthHz, 14.51e6)).toBeLessThan(1e-3);
    expect(rel(e.photonEnergyJ, 1.28158e-19)).toBeLessThan(1e-5);
    expect(e.totalOutputPowerMw).toBe(2);
    expect(e.assumptions.join(' ')).toMatch(/taken as equal/);
  });

  it('10 mW per facet → 1.451 MHz (the 1/P law); Schawlow–Townes (α = 0) is the Henry value / (1 + α²) = /17', () => {
    const e = estimateLaserLinewidth({ ...henry, mirrorLossPerCm: 30.1, outputPowerMw: 10 });
    expect(rel(e.enhancedLinewidthHz, 1.451e6)).toBeLessThan(1e-3);
    expect(rel(e.schawlowTownesLinewidthHz, e.enhancedLinewidthHz / 17)).toBeLessThan(1e-12);
  });

  it('facet reflectivities [0.3, 0.3] over 400 µm give α_m = ln(1/0.3)/L = 30.10 /cm and the same 14.51 MHz', () => {
    const e = estimateLaserLinewidth({ ...henry, facetReflectivities: [0.3, 0.3], outputPowerMw: 1 });
    expect(e.mirrorLossPerCm).toBeCloseTo(Math.log(1 / 0.3) / 0.04, 10);
    expect(e.outputFacetShare).toBe(0.5);
    expect(rel(e.enhancedLinewidthHz, 14.51e6)).toBeLessThan(1e-3);
  });

  it('the photon-number form v_g g_th n_sp(1+α²)/(4πN_ph) (METHODS 6.1) equals the cavity form', () => {
    const e = estimateLaserLinewidth({ ...henry, facetReflectivities: [0.3, 0.9], outputPowerMw: 3 });
    const vgGth = e.groupVelocityMPerS * e.thresholdGainPerCm * 100;
    expect(rel(phaseDiffusionLinewidthHz(vgGth * 2, e.photonNumber, 4), e.enhancedLinewidthHz)).toBeLessThan(1e-12);
  });

  it('unequal facets: the output share of facet 1 is (1−R₁)√R₂/((1−R₁)√R₂ + (1−R₂)√R₁) — an HR back facet sends nearly all out the front', () => {
    const e = estimateLaserLinewidth({ ...henry, facetReflectivities: [0.05, 0.95], outputPowerMw: 1 });
    const a = 0.95 * Math.sqrt(0.95);
    const b = 0.05 * Math.sqrt(0.05);
    expect(e.outputFacetShare).toBeCloseTo(a / (a + b), 12);
    expect(e.outputFacetShare).toBeGreaterThan(0.98);
  });

  it('cavity form checks (METHODS 6.1): Δν_c = 1 MHz, 10 mW, ideal → 4.0e-5 Hz; 100 MHz, n_sp 2, α 4, η₀ 0.5 → 6.84 Hz', () => {
    const nu = 299792458 / 1550e-9;
    expect(rel(cavityFormLinewidthHz({ opticalFrequencyHz: nu, coldCavityLinewidthHz: 1e6, nsp: 1, alphaFactor: 0, opticalEfficiency: 1, totalOutputPowerW: 0.01 }), 4.026e-5)).toBeLessThan(1e-3);
    expect(rel(cavityFormLinewidthHz({ opticalFrequencyHz: nu, coldCavityLinewidthHz: 1e8, nsp: 2, alphaFactor: 4, opticalEfficiency: 0.5, totalOutputPowerW: 0.01 }), 6.845)).toBeLessThan(1e-3);
  });

  it('phaseDiffusionLinewidthHz(R_sp, P, α) = R_sp(1+α²)/(4πP) by hand: 4π·1e5 photons, R_sp = 1e12, α = 0 → 1e12/(4π·1e5)', () => {
    expect(phaseDiffusionLinewidthHz(1e12, 1e5, 0)).toBeCloseTo(1e12 / (4 * Math.PI * 1e5), 6);
    expect(phaseDiffusionLinewidthHz(1e12, 1e5, 3)).toBeCloseTo((10 * 1e12) / (4 * Math.PI * 1e5), 5);
  });

  it('rejects bad input, naming the rule', () => {
    const ok = { ...henry, mirrorLossPerCm: 30, outputPowerMw: 1 };
    expect(() => estimateLaserLinewidth({ ...ok, wavelengthNm: -1 })).toThrow(/wavelengthNm/);
    expect(() => estimateLaserLinewidth({ ...ok, groupIndex: 0.5 })).toThrow(/groupIndex must be >= 1/);
    expect(() => estimateLaserLinewidth({ ...ok, nsp: 0.5 })).toThrow(/nsp must be >= 1/);
    expect(() => estimateLaserLinewidth({ ...ok, outputPowerMw: 0 })).toThrow(/outputPowerMw/);
    expect(() => estimateLaserLinewidth({ ...ok, internalLossPerCm: -1 })).toThrow(/internalLossPerCm/);
    expect(() => estimateLaserLinewidth({ ...ok, facetReflectivities: [0.3, 0.3] })).toThrow(/not both/);
    expect(() => estimateLaserLinewidth({ ...henry, outputPowerMw: 1 })).toThrow(/give facetReflectivities/);
    expect(() => estimateLaserLinewidth({ ...henry, facetReflectivities: [1, 0.3], outputPowerMw: 1 })).toThrow(/R1 must be < 1/);
    expect(() => estimateLaserLinewidth({ ...henry, facetReflectivities: [0.3, 1.2], outputPowerMw: 1 })).toThrow(AnalysisInputError);
  });
});

describe('fitLinewidthPowerSweep: Δν = a/P + Δν₀ (METHODS 6.3)', () => {
  const powers = [2, 4, 6, 8, 10, 15, 20];
  const exact = powers.map((p) => 2000 / (p * 1e-3) + 150e3);

  it('P = [2 … 20] mW, Δν = 2000/P[W] + 150 kHz → slope 2000 Hz·W, floor 150 kHz to 1e-9, r² = 1 (METHODS 6.3 / row 15)', () => {
    const r = fitLinewidthPowerSweep({ powersMw: powers, linewidthsHz: exact });
    expect(rel(r.slopeHzW, 2000)).toBeLessThan(1e-9);
    expect(rel(r.floorHz, 150e3)).toBeLessThan(1e-9);
    expect(r.r2).toBeCloseTo(1, 12);
    expect(r.warnings).toEqual([]);
  });

  it('with given uncertainties the covariance is (XᵀWX)⁻¹: three points at x = 1, 2, 3 /W with σ = 1 Hz → var a = 1/2, var Δν₀ = 7/3 (by hand)', () => {
    // X = [[1,1],[2,1],[3,1]]: XᵀX = [[14, 6], [6, 3]], det 6 → inverse [[3, −6], [−6, 14]]/6
    const r = fitLinewidthPowerSweep({ powersMw: [1000, 500, 1000 / 3], linewidthsHz: [11, 22, 29], uncertaintiesHz: [1, 1, 1] });
    expect(r.covariance[0][0]).toBeCloseTo(0.5, 10);
    expect(r.covariance[1][1]).toBeCloseTo(14 / 6, 10);
    expect(r.covariance[0][1]).toBeCloseTo(-1, 10);
    expect(r.slopeHzW).toBeCloseTo(9, 10); // least squares through (1,11), (2,22), (3,29)
    expect(r.floorHz).toBeCloseTo(8 / 3, 10);
    expect(r.weighted).toBe(true);
  });

  it('without uncertainties the scatter sets them: s² = Σr²/(n−2)', () => {
    const noisy = exact.map((v, i) => v + (i % 2 === 0 ? 1e3 : -1e3));
    const r = fitLinewidthPowerSweep({ powersMw: powers, linewidthsHz: noisy });
    const ss = Array.from(r.residualsHz).reduce((s, v) => s + v * v, 0);
    const x = powers.map((p) => 1000 / p);
    const mx = x.reduce((s, v) => s + v, 0) / x.length;
    const sxx = x.reduce((s, v) => s + (v - mx) ** 2, 0);
    expect(r.slopeUncertaintyHzW).toBeCloseTo(Math.sqrt(ss / 5 / sxx), 8);
    expect(rel(r.slopeHzW, 2000)).toBeLessThan(0.05);
  });

  it('warns on a negative slope (linewidth rising with power)', () => {
    const r = fitLinewidthPowerSweep({ powersMw: [1, 2, 3], linewidthsHz: [1e5, 2e5, 3e5] });
    expect(r.warnings.join(' ')).toMatch(/slope is negative/);
  });

  it('rejects bad sweeps', () => {
    expect(() => fitLinewidthPowerSweep({ powersMw: [1, 2], linewidthsHz: [1, 2] })).toThrow(/at least 3 points/);
    expect(() => fitLinewidthPowerSweep({ powersMw: [1, 2, 3], linewidthsHz: [1, 2] })).toThrow(/equal lengths/);
    expect(() => fitLinewidthPowerSweep({ powersMw: [1, -2, 3], linewidthsHz: [1, 2, 3] })).toThrow(/point 1/);
    expect(() => fitLinewidthPowerSweep({ powersMw: [2, 2, 2], linewidthsHz: [1, 2, 3] })).toThrow(/two different powers/);
    expect(() => fitLinewidthPowerSweep({ powersMw: [1, 2, 3], linewidthsHz: [1, 2, 3], uncertaintiesHz: [1, 0, 1] })).toThrow(/uncertainties/);
  });
});
