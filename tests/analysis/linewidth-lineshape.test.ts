import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { lineshape } from '../../analysis/linewidth/lineshape';
import fixture from '../fixtures/linewidth/lineshape-bump.json';
import { linearSpectrum, logSpectrum } from '../fixtures/linewidth/spectra';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

// Tolerances: our quadrature is exact on each interpolated piece and Simpson in τ (error < 1e-6);
// what remains is reading the tabulated S_ν between grid points (200 points/decade: ~1e-5).
// We state 1e-4 relative for exact algebra and 1e-3 against tables printed to 4–6 digits.

describe('lineshape of white frequency noise (METHODS 3.2)', () => {
  const white = logSpectrum(1e-3, 1e7, 200, () => 1e4);

  it('white h0 = 1e4, T0 → ∞ (1e3 s): FWHM = π·h0 = 31415.93 Hz (Lorentzian, METHODS 3.2 and check 6; 1e-4)', () => {
    const r = lineshape(white, { observationTimeS: 1e3, tailLevelHz2PerHz: 1e4 });
    expect(r.carrierDominated).toBe(false);
    expect(rel(r.fwhmHz as number, 31415.93)).toBeLessThan(1e-4);
    expect(r.carrierFraction).toBe(0);
  });

  it('samples a Lorentzian 1/(1 + (2ν/FWHM)²): power 1 at 0, 1/2 at FWHM/2, 1/5 at FWHM (to 1e-4)', () => {
    const r = lineshape(white, { observationTimeS: 1e3, tailLevelHz2PerHz: 1e4, displayPoints: 9, displaySpanFwhm: 2 });
    const w = Math.PI * 1e4;
    expect(r.offsetHz).toHaveLength(9);
    expect(r.offsetHz[0]).toBe(0);
    expect(r.power[0]).toBeCloseTo(1, 12);
    for (let i = 0; i < 9; i++) {
      const x = (2 * r.offsetHz[i]) / w;
      expect(Math.abs(r.power[i] - 1 / (1 + x * x))).toBeLessThan(1e-4);
    }
    expect(r.offsetHz[8] / (r.fwhmHz as number)).toBeCloseTo(2, 12);
  });

  it('defaults the white tail to the mean of the last points and the display to 129 points over 4 FWHM', () => {
    const r = lineshape(white, { observationTimeS: 1e3 });
    expect(r.tailLevelHz2PerHz).toBeCloseTo(1e4, 9);
    expect(rel(r.fwhmHz as number, Math.PI * 1e4)).toBeLessThan(1e-4);
    expect(r.offsetHz).toHaveLength(129);
    expect(r.offsetHz[128] / (r.fwhmHz as number)).toBeCloseTo(4, 12);
  });

  it('the analytic white tail stands in for the grid above maxHz: a grid cut at 100 kHz gives the same FWHM', () => {
    const r = lineshape(white, { observationTimeS: 1e3, maxHz: 1e5, tailLevelHz2PerHz: 1e4 });
    expect(rel(r.fwhmHz as number, Math.PI * 1e4)).toBeLessThan(1e-4);
  });
});

describe('lineshape of white + flicker noise with a sharp cut at 1/T0 (METHODS 3.3 "exact FWHM" column, 1e-3)', () => {
  const table: [number, number, number, number][] = [
    [1e4, 1e8, 1e-3, 61781.5],
    [1e4, 1e8, 1e-2, 75728.2],
    [1e4, 1e8, 1e-1, 86308.6],
    [1e4, 1e8, 1, 95327.4],
    [1e3, 1e9, 1e-3, 157284],
    [1e3, 1e9, 1e-2, 197337],
    [1e3, 1e9, 1e-1, 229506],
    [1e3, 1e9, 1, 257249],
    [1e2, 1e8, 1e-3, 41073.5],
    [1e2, 1e8, 1, 76724.4],
    [10, 1e6, 1e-2, 4107.35],
    [10, 1e6, 1, 6732.76],
  ];
  it.each(table)('S = %d + %d/f, T0 = %d s → FWHM %d Hz', (h0, h1, t0, fwhm) => {
    const r = lineshape(logSpectrum(0.1, 1e8, 200, (f) => h0 + h1 / f), { observationTimeS: t0, tailLevelHz2PerHz: h0 });
    expect(rel(r.fwhmHz as number, fwhm)).toBeLessThan(1e-3);
  });

  it('S = 1e3 + 1e9/f, T0 = 10 ms on 1000 points/decade → 197337 Hz to 2e-5 (METHODS 3.5 [N]: 197337.0 Hz)', () => {
    const r = lineshape(logSpectrum(10, 1e7, 1000, (f) => 1e3 + 1e9 / f), { observationTimeS: 1e-2, tailLevelHz2PerHz: 1e3 });
    expect(rel(r.fwhmHz as number, 197337)).toBeLessThan(2e-5);
  });

  it('S = 10 + 1e6/f, T0 = 1 ms is carrier-dominated: fwhmHz null, carrier fraction exp(−0.51) (METHODS 3.3: D/2 → 0.51)', () => {
    // ∫_{1/T0}^∞ (h0 + h₋₁/f)/f² df = h0·T0 + h₋₁·T0²/2 = 0.01 + 0.5
    const r = lineshape(logSpectrum(0.1, 1e8, 200, (f) => 10 + 1e6 / f), { observationTimeS: 1e-3, tailLevelHz2PerHz: 10 });
    expect(r.carrierDominated).toBe(true);
    expect(r.fwhmHz).toBeNull();
    expect(r.offsetHz).toHaveLength(0);
    expect(rel(r.carrierFraction, Math.exp(-0.51))).toBeLessThan(1e-4);
    expect(r.warnings.join(' ')).toMatch(/line dominated by a coherent carrier at this T0/);
  });
});

describe('lineshape of pure flicker noise (METHODS 3.4 universal table, FWHM·T0 against h₋₁T0², 1e-3)', () => {
  const table: [number, number][] = [
    [1e2, 40.89],
    [1e3, 155.46],
    [1e4, 559.4],
    [1e6, 6715],
    [1e8, 76551],
    [1e10, 8.482e5],
    [1e12, 9.2296e6],
  ];
  it.each(table)('h₋₁T0² = %d → FWHM·T0 = %d', (q, fwhmT0) => {
    // T0 = 1 s, h₋₁ = q; the grid reaches 1000 × the expected FWHM, beyond which flicker adds < 1e-6 rad²
    const top = Math.max(1e6, 1000 * fwhmT0);
    const r = lineshape(logSpectrum(0.5, top, 200, (f) => q / f), { observationTimeS: 1, tailLevelHz2PerHz: 0 });
    expect(rel(r.fwhmHz as number, fwhmT0)).toBeLessThan(1e-3);
  });

  it('depends only on h₋₁T0² (scale invariance, METHODS 3.4): h₋₁ = 1e8, T0 = 10 ms → 559.4 / T0 = 55940 Hz', () => {
    const r = lineshape(logSpectrum(10, 1e8, 200, (f) => 1e8 / f), { observationTimeS: 1e-2, tailLevelHz2PerHz: 0 });
    expect(rel(r.fwhmHz as number, 55940)).toBeLessThan(1e-3);
  });
});

describe('lineshape of low-pass-filtered white noise (METHODS 3.3 table, h0 = 1e3, T0 = ∞, exact FWHM, 1e-3)', () => {
  const table: [number, number][] = [
    [0.01, 235.33],
    [0.1, 739.84],
    [0.3, 1264.19],
    [1, 2186.2],
    [1.78, 2702.97],
    [3, 3024.21],
    [10, 3139.65],
    [100, 3141.59],
  ];
  it.each(table)('fc/h0 = %d → FWHM %d Hz', (ratio, fwhm) => {
    // S = h0 below fc, nothing above (no tail); T0 = 1e7 s stands for ∞
    const fc = ratio * 1e3;
    const r = lineshape(logSpectrum(1e-8, fc, 200, () => 1e3), { observationTimeS: 1e7, tailLevelHz2PerHz: 0 });
    expect(rel(r.fwhmHz as number, fwhm)).toBeLessThan(1e-3);
  });
});

describe('lineshape against a scipy reference (tests/fixtures/linewidth/make-lineshape-fixture.py)', () => {
  it('white + flicker + a Lorentzian bump at 200 kHz, T0 = 10 ms: FWHM within 3e-4 of the QUADPACK/sici reference', () => {
    const s = logSpectrum(1, 1e8, 200, (f) =>
      fixture.whiteHz2PerHz + fixture.flickerHz2 / f + fixture.bumpHz2PerHz / (1 + ((f - fixture.bumpCentreHz) / fixture.bumpHalfWidthHz) ** 2),
    );
    const r = lineshape(s, { observationTimeS: fixture.observationTimeS, tailLevelHz2PerHz: fixture.whiteHz2PerHz });
    expect(rel(r.fwhmHz as number, fixture.fwhmHz)).toBeLessThan(3e-4);
  });
});

describe('lineshape on a long linear Welch grid', () => {
  it('averages 65536 bins onto log bins, says so, and still gives 197337 Hz for S = 1e3 + 1e9/f, T0 = 10 ms (METHODS 3.3, 1e-3)', () => {
    // fs = 1 MHz, L = 2^17: 7.63 Hz bins up to 500 kHz
    const s = linearSpectrum(1e6 / 131072, 1, 65536, (f) => 1e3 + 1e9 / f);
    const r = lineshape(s, { observationTimeS: 1e-2, tailLevelHz2PerHz: 1e3 });
    expect(rel(r.fwhmHz as number, 197337)).toBeLessThan(1e-3);
    expect(r.warnings.join(' ')).toMatch(/averaged onto 1000 log bins per decade/);
  });
});

describe('lineshape low end: the first point within 2.1/T0 is stretched flat down to 1/T0', () => {
  // carrier floor Γ(∞) = exp(−∫_{1/T0}^∞ S_ν/f² df); for white S = h0 that integral is h0·T0 exactly
  it('white h0 = 1 Hz²/Hz from f1 = 1.5 Hz, T0 = 1 s: Γ(∞) = exp(−h0·T0) = e⁻¹ (not exp(−h0/f1) = e^−⅔ from f1)', () => {
    const r = lineshape(logSpectrum(1.5, 1e6, 200, () => 1), { observationTimeS: 1, tailLevelHz2PerHz: 1 });
    expect(rel(r.carrierFraction, Math.exp(-1))).toBeLessThan(1e-9);
    expect(r.carrierDominated).toBe(true);
    expect(r.warnings.join(' ')).not.toMatch(/starts at/);
    expect(r.notes.join(' ')).toMatch(/taken flat at that point's level/);
  });

  it('white h0 = 1e4 from f1 = 1.9 Hz, T0 = 1 s: FWHM = π·h0 within 1e-4, no warning', () => {
    const r = lineshape(logSpectrum(1.9, 1e7, 200, () => 1e4), { observationTimeS: 1, tailLevelHz2PerHz: 1e4 });
    expect(rel(r.fwhmHz as number, Math.PI * 1e4)).toBeLessThan(1e-4);
    expect(r.warnings).toEqual([]);
    expect(r.notes).toHaveLength(1);
  });

  it('ignores a DC bin: bins [0, 2, 4, …] Hz with S(0) = 0 read flat at S(2 Hz) down to 1/T0 = 1 Hz', () => {
    const grid = linearSpectrum(2, 0, 5e5, (f) => (f === 0 ? 0 : 1));
    const r = lineshape(grid, { observationTimeS: 1, tailLevelHz2PerHz: 1 });
    expect(rel(r.carrierFraction, Math.exp(-1))).toBeLessThan(1e-6);
  });
});

describe("lineshape(s, { interpolation: 'linear' })", () => {
  it('white h0 = 1e4 on a 30-point-per-decade grid, T0 → ∞: FWHM = π·h0 (1e-4), the grid points are the nodes', () => {
    const r = lineshape(logSpectrum(1e-3, 1e7, 30, () => 1e4), { observationTimeS: 1e3, tailLevelHz2PerHz: 1e4, interpolation: 'linear' });
    expect(rel(r.fwhmHz as number, Math.PI * 1e4)).toBeLessThan(1e-4);
  });

  it('keeps a Hann line of power P at f_m in ∫S_ν/f² df: ln Γ(∞) = −(h0·T0 + P/f_m²) within 0.5 % (h0 = 1, P = 2500, f_m = 50.3 Hz)', () => {
    // Welch bins h0 + (P/1.5)|W(m − f_m)|² on a 1 Hz grid (Harris 1978; the kernel sums to 1.5 bins)
    const kernel = (d: number) => {
      if (Math.abs(d) < 1e-12) return 1;
      if (Math.abs(Math.abs(d) - 1) < 1e-12) return 0.25;
      const v = Math.sin(Math.PI * d) / (Math.PI * d) / (1 - d * d);
      return v * v;
    };
    const grid = linearSpectrum(1, 1, 4000, (f) => 1 + (Math.abs(f - 50.3) <= 12 ? (2500 / 1.5) * kernel(f - 50.3) : 0));
    const r = lineshape(grid, { observationTimeS: 1, tailLevelHz2PerHz: 1, interpolation: 'linear' });
    const expected = 1 + 2500 / (50.3 * 50.3);
    expect(rel(-Math.log(r.carrierFraction), expected)).toBeLessThan(5e-3);
  });
});

describe('lineshape warnings and rejected options', () => {
  const s = logSpectrum(1, 1e6, 50, () => 1e4);
  it('warns when the spectrum starts above 2.1/T0 (the FWHM a lower bound)', () => {
    const r = lineshape(s, { observationTimeS: 10 });
    expect(r.warnings.join(' ')).toMatch(/starts at 1 Hz, above 1\/T0/);
    expect(r.notes).toEqual([]);
  });
  it("interpolation = 'cubic' throws AnalysisInputError", () => {
    expect(() => lineshape(s, { observationTimeS: 1, interpolation: 'cubic' as never })).toThrow(/interpolation must be/);
  });
  it('observationTimeS = -1 throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: -1 })).toThrow(AnalysisInputError);
  });
  it('maxHz above the top of the grid throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: 1, maxHz: 1e7 })).toThrow(/maxHz/);
  });
  it('tailLevelHz2PerHz = -5 throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: 1, tailLevelHz2PerHz: -5 })).toThrow(/tailLevelHz2PerHz/);
  });
  it('displayPoints = 1 throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: 1, displayPoints: 1 })).toThrow(/displayPoints/);
  });
  it('displaySpanFwhm = 0 throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: 1, displaySpanFwhm: 0 })).toThrow(/displaySpanFwhm/);
  });
  it('1/T0 above the band throws AnalysisInputError', () => {
    expect(() => lineshape(s, { observationTimeS: 1e-7 })).toThrow(/1\/T0/);
  });
});
