import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { betaLine, betaSeparation } from '../../analysis/linewidth/beta-line';
import { linearSpectrum, logSpectrum } from '../fixtures/linewidth/spectra';

// Di Domenico, Schilt, Thomann, Appl. Opt. 49(25), 4801 (2010): β(f) = 8 ln2 f/π², FWHM = √(8 ln2 A)
const C = (8 * Math.LN2) / (Math.PI * Math.PI);

/** closed form for S = h0 + h₋₁/f (METHODS 3.3 [D]) */
function whiteFlicker(h0: number, h1: number, t0: number) {
  const fx = (h0 + Math.sqrt(h0 * h0 + 4 * C * h1)) / (2 * C);
  const area = h0 * (fx - 1 / t0) + h1 * Math.log(fx * t0);
  return { fx, area, fwhm: Math.sqrt(8 * Math.LN2 * area) };
}

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('betaSeparation', () => {
  it('betaSeparation(f) = 8 ln2 f/π² (Di Domenico et al. 2010): 5618.44 Hz²/Hz at 10 kHz', () => {
    expect(betaSeparation(1e4)).toBeCloseTo(5618.4394, 3);
    expect(betaSeparation(0)).toBe(0);
  });
});

describe('betaLine on analytic spectra', () => {
  it('white h0 = 1e4 with T0 → ∞ (1e6 s) gives FWHM = π·h0 and f_x = π²h0/(8 ln2) (METHODS 3.3, exact algebra; check 7)', () => {
    const r = betaLine(logSpectrum(1e-7, 1e7, 200, () => 1e4), { observationTimeS: 1e6 });
    expect(rel(r.linewidthHz, Math.PI * 1e4)).toBeLessThan(1e-6);
    expect(rel(r.crossingHz as number, (Math.PI * Math.PI * 1e4) / (8 * Math.LN2))).toBeLessThan(1e-9);
    expect(r.truncated).toBe(false);
    expect(r.carrierDominated).toBe(false);
    expect(r.warnings).toEqual([]);
  });

  // METHODS 3.3, table "White + flicker with sharp cut at 1/T0", β FWHM column
  const table: [number, number, number, number][] = [
    [1e4, 1e8, 1e-3, 55774.6],
    [1e4, 1e8, 1e-2, 66614.9],
    [1e4, 1e8, 1e-1, 75626.4],
    [1e4, 1e8, 1, 83646.2],
    [1e3, 1e9, 1e-3, 145262],
    [1e3, 1e9, 1e-2, 184050],
    [1e3, 1e9, 1e-1, 215970],
    [1e3, 1e9, 1, 243745],
    [1e2, 1e8, 1e-3, 38042.9],
    [1e2, 1e8, 1, 72651.8],
    [10, 1e6, 1e-2, 3804.29],
    [10, 1e6, 1, 6325.71],
  ];
  it.each(table)(
    'S = %d + %d/f, T0 = %d s: area and f_x match the closed form to 1e-4 and FWHM the METHODS 3.3 table value %d Hz',
    (h0, h1, t0, tableFwhm) => {
      const r = betaLine(logSpectrum(1e-3, 1e8, 200, (f) => h0 + h1 / f), { observationTimeS: t0 });
      const exact = whiteFlicker(h0, h1, t0);
      expect(rel(r.areaHz2, exact.area)).toBeLessThan(1e-4);
      expect(rel(r.crossingHz as number, exact.fx)).toBeLessThan(1e-4);
      // the table is printed to 6 significant digits
      expect(rel(r.linewidthHz, tableFwhm)).toBeLessThan(1e-5);
      expect(r.intervalsHz).toHaveLength(1);
      expect(r.intervalsHz[0][0]).toBe(1 / t0);
    },
  );

  it('starts exactly at 1/T0 with a partial first bin on a Welch grid (METHODS 3.3: 15.26 Hz bins, 1/T0 = 100 Hz)', () => {
    // fs = 1 MHz, L = 2^16: bins m·15.2588 Hz; S = 1e3 + 1e9/f; T0 = 10 ms → β FWHM 184050 Hz (METHODS 3.3 table)
    const df = 1e6 / 65536;
    const spectrum = linearSpectrum(df, 0, 32768, (f) => (f === 0 ? 0 : 1e3 + 1e9 / f));
    const r = betaLine(spectrum, { observationTimeS: 1e-2 });
    expect(r.intervalsHz[0][0]).toBe(100);
    expect(rel(r.areaHz2, whiteFlicker(1e3, 1e9, 1e-2).area)).toBeLessThan(1e-4);
    expect(rel(r.linewidthHz, 184050)).toBeLessThan(1e-4);
    // starting at the next bin above 1/T0 (7·df = 106.8 Hz) loses about 1.1 % of A (METHODS 3.3 [N])
    const nextBin = betaLine(spectrum, { observationTimeS: 1 / (7 * df) });
    expect(1 - nextBin.areaHz2 / r.areaHz2).toBeGreaterThan(0.009);
    expect(1 - nextBin.areaHz2 / r.areaHz2).toBeLessThan(0.013);
  });

  it('reads a hand-checkable grid with a zero as straight lines: f = [10, 100, 200], S = [0, 1000, 1000], 1/T0 = 50 Hz → A = 136111.1', () => {
    // S(50) = 1000·40/90 = 444.44; ∫_50^100 = (444.44 + 1000)/2·50 = 36111.11; ∫_100^200 1000 df = 100000;
    // β(200) = 112.4 < 1000, so the area is truncated at 200 Hz
    const spectrum = { frequencyHz: Float64Array.of(10, 100, 200), psd: Float64Array.of(0, 1000, 1000) };
    const r = betaLine(spectrum, { observationTimeS: 1 / 50 });
    expect(r.areaHz2).toBeCloseTo(136111.111, 2);
    expect(r.truncated).toBe(true);
    expect(r.intervalsHz).toEqual([[50, 200]]);
  });

  it('treats a DC bin as outside the spectrum: bins [0, 100, 200] Hz, 1/T0 = 50 Hz → flat at S(100 Hz) down to 50 Hz, not a ramp from DC', () => {
    const spectrum = { frequencyHz: Float64Array.of(0, 100, 200), psd: Float64Array.of(0, 1000, 1000) };
    const r = betaLine(spectrum, { observationTimeS: 1 / 50 });
    // 1000·(200 − 50): the first positive point is 2/T0, within the low-end rule's 2.1/T0
    expect(r.areaHz2).toBeCloseTo(150000, 6);
    expect(r.intervalsHz).toEqual([[50, 200]]);
    expect(r.warnings.join(' ')).not.toMatch(/starts at/);
    expect(r.notes.join(' ')).toMatch(/taken flat at that point's level .* down to 1\/T0 = 50\.00 Hz/);
  });

  it('adds every interval where S_ν > β: white h0 = 1e4 plus a 1e6 plateau on [200, 210] kHz', () => {
    const h0 = 1e4;
    const eps = 1e-3;
    const base = logSpectrum(1, 1e6, 200, () => h0);
    const f: number[] = [];
    const s: number[] = [];
    for (let i = 0; i < base.frequencyHz.length; i++) {
      const x = base.frequencyHz[i];
      if (x > 2e5 - eps && x < 2.1e5 + eps) continue;
      if (x > 2.1e5 && f[f.length - 1] < 2e5) {
        // steep edges: contribute < 1e-9 of the area
        f.push(2e5 - eps, 2e5, 2.1e5, 2.1e5 + eps);
        s.push(h0, 1e6, 1e6, h0);
      }
      f.push(x);
      s.push(h0);
    }
    const r = betaLine({ frequencyHz: Float64Array.from(f), psd: Float64Array.from(s) }, { observationTimeS: 1 });
    const fx = (Math.PI * Math.PI * h0) / (8 * Math.LN2);
    expect(r.intervalsHz).toHaveLength(2);
    expect(rel(r.areaHz2, h0 * (fx - 1) + 1e6 * 1e4)).toBeLessThan(1e-6);
    expect(rel(r.crossingHz as number, 2.1e5)).toBeLessThan(1e-6);
    expect(rel(r.intervalsHz[0][1], fx)).toBeLessThan(1e-9);
  });

  it('reports a coherent carrier when 1/T0 >= f_x: S = 10 + 1e6/f, T0 = 0.1 ms (f_x = 1343 Hz, METHODS 3.3)', () => {
    const r = betaLine(logSpectrum(1, 1e7, 100, (f) => 10 + 1e6 / f), { observationTimeS: 1e-4 });
    expect(r.areaHz2).toBe(0);
    expect(r.linewidthHz).toBe(0);
    expect(r.carrierDominated).toBe(true);
    expect(r.intervalsHz).toEqual([]);
    expect(rel(r.crossingHz as number, whiteFlicker(10, 1e6, 1).fx)).toBeLessThan(1e-4);
    expect(r.warnings.join(' ')).toMatch(/line dominated by a coherent carrier at this T0/);
  });

  it('warns that the area is truncated when S_ν is still above β at the top of the band', () => {
    // S = 1e4 + 1e8/f up to 10 kHz (f_x = 24.9 kHz is above it): A = h0(1e4 − 1e3) + h₋₁ ln(10)
    const r = betaLine(logSpectrum(1, 1e4, 400, (f) => 1e4 + 1e8 / f), { observationTimeS: 1e-3 });
    expect(r.truncated).toBe(true);
    expect(r.crossingHz).toBeNull();
    expect(rel(r.areaHz2, 1e4 * 9e3 + 1e8 * Math.log(10))).toBeLessThan(1e-5);
    expect(r.warnings.join(' ')).toMatch(/truncated/);
  });

  it('betaLine(s, { maxHz }) stops the area at maxHz', () => {
    const s = logSpectrum(1, 1e7, 200, (f) => 1e4 + 1e8 / f);
    const r = betaLine(s, { observationTimeS: 1e-3, maxHz: 1e4 });
    expect(r.truncated).toBe(true);
    expect(rel(r.areaHz2, 1e4 * 9e3 + 1e8 * Math.log(10))).toBeLessThan(1e-5);
  });

  it('warns when the spectrum starts above 1/T0 and integrates from its first point', () => {
    const r = betaLine(logSpectrum(10, 1e7, 200, (f) => 1e4 + 1e8 / f), { observationTimeS: 1 });
    expect(r.warnings.join(' ')).toMatch(/starts at 10 Hz, above 1\/T0/);
    expect(r.notes).toEqual([]);
    expect(r.intervalsHz[0][0]).toBe(10);
    expect(rel(r.areaHz2, whiteFlicker(1e4, 1e8, 0.1).area)).toBeLessThan(1e-4);
  });
});

describe('betaLine low end: the first point within 2.1/T0 is stretched flat down to 1/T0', () => {
  // white S = h0 on a grid starting at f1: A = h0(f_x − 1/T0) exactly, i.e. h0·(f1 − 1/T0) more than from f1
  const h0 = 1e4;
  const fx = (Math.PI * Math.PI * h0) / (8 * Math.LN2);
  it.each([
    [1.5, 1],
    [2, 1],
    [2.1, 1],
    [1.0001, 1],
  ])('white h0 = 1e4, first point %f Hz, T0 = %f s: A = h0·(f_x − 1/T0), no warning, a note', (f1, t0) => {
    const r = betaLine(logSpectrum(f1, 1e7, 200, () => h0), { observationTimeS: t0 });
    expect(rel(r.areaHz2, h0 * (fx - 1 / t0))).toBeLessThan(1e-9);
    // the extension adds exactly h0·(f1 − 1/T0) to the area from f1
    expect(rel(r.areaHz2 - h0 * (fx - f1), h0 * (f1 - 1 / t0))).toBeLessThan(1e-6);
    expect(r.intervalsHz[0][0]).toBeCloseTo(1 / t0, 12);
    expect(r.warnings).toEqual([]);
    expect(r.notes).toHaveLength(1);
  });

  it('beyond 2.1/T0 (first point 2.2 Hz, T0 = 1 s) it starts at the first point and warns (a lower bound)', () => {
    const r = betaLine(logSpectrum(2.2, 1e7, 200, () => h0), { observationTimeS: 1 });
    expect(rel(r.areaHz2, h0 * (fx - 2.2))).toBeLessThan(1e-9);
    expect(r.warnings.join(' ')).toMatch(/starts at 2\.2 Hz, above 1\/T0 = 1 Hz/);
    expect(r.notes).toEqual([]);
  });

  it('for flicker h₋₁/f from f1 = 2/T0 the flat slice holds h₋₁/2 instead of h₋₁·ln 2 (the stated 28 % shortfall of that slice)', () => {
    const h1 = 1e8;
    const t0 = 1;
    const from2 = betaLine(logSpectrum(2, 1e7, 400, (f) => h0 + h1 / f), { observationTimeS: t0 });
    const exact = whiteFlicker(h0, h1, t0).area;
    // ∫_1^2 h₋₁/f df = h₋₁ ln 2 against the flat (h₋₁/2)·(2 − 1); the white part of the slice is exact
    const missing = h1 * (Math.LN2 - 0.5);
    expect(rel(exact - from2.areaHz2, missing)).toBeLessThan(1e-4);
  });
});

describe("betaLine(s, { interpolation: 'linear' }) keeps the power of a spectral line on a Welch grid", () => {
  // white h0 = 1e4 on a 1 Hz Welch grid plus a Hann-windowed line of power P at 50.3 Hz: bin m reads
  // h0 + (P/1.5)·|W(m − 50.3)|², |W(δ)|² = [sinc δ/(1 − δ²)]² (Harris 1978), whose sum over all bins is
  // the ENBW, 1.5 bins (METHODS 1.2) — so ∫S df over the grid holds exactly P more than the white part
  const h0 = 1e4;
  const P = 1e7;
  const kernel = (d: number) => {
    if (Math.abs(d) < 1e-12) return 1;
    if (Math.abs(Math.abs(d) - 1) < 1e-12) return 0.25;
    const v = Math.sin(Math.PI * d) / (Math.PI * d) / (1 - d * d);
    return v * v;
  };
  const grid = linearSpectrum(1, 1, 50000, (f) => h0 + (Math.abs(f - 50.3) <= 12 ? (P / 1.5) * kernel(f - 50.3) : 0));
  const fx = (Math.PI * Math.PI * h0) / (8 * Math.LN2);

  it('linear: A = h0·(f_x − 1/T0) + P to 1e-5', () => {
    const r = betaLine(grid, { observationTimeS: 1, interpolation: 'linear' });
    expect(rel(r.areaHz2, h0 * (fx - 1) + P)).toBeLessThan(1e-5);
  });

  it('the power law through the peak and its low neighbours loses more than 10 % of the line', () => {
    const r = betaLine(grid, { observationTimeS: 1 });
    expect(h0 * (fx - 1) + P - r.areaHz2).toBeGreaterThan(0.1 * P);
  });

  it("linear on a white log grid is exact too: FWHM = π·h0 for T0 → ∞", () => {
    const r = betaLine(logSpectrum(1e-7, 1e7, 30, () => h0), { observationTimeS: 1e6, interpolation: 'linear' });
    expect(rel(r.linewidthHz, Math.PI * h0)).toBeLessThan(1e-6);
  });
});

describe('betaLine rejects bad options', () => {
  const s = logSpectrum(1, 1e6, 50, () => 1e4);
  it("interpolation = 'cubic' throws AnalysisInputError", () => {
    expect(() => betaLine(s, { observationTimeS: 1, interpolation: 'cubic' as never })).toThrow(/interpolation must be/);
  });
  it('observationTimeS = 0 throws AnalysisInputError', () => {
    expect(() => betaLine(s, { observationTimeS: 0 })).toThrow(AnalysisInputError);
  });
  it('observationTimeS = NaN throws AnalysisInputError', () => {
    expect(() => betaLine(s, { observationTimeS: Number.NaN })).toThrow(/observationTimeS/);
  });
  it('maxHz above the top of the grid throws AnalysisInputError', () => {
    expect(() => betaLine(s, { observationTimeS: 1, maxHz: 2e6 })).toThrow(/maxHz/);
  });
  it('1/T0 above the band throws AnalysisInputError', () => {
    expect(() => betaLine(s, { observationTimeS: 1e-7 })).toThrow(/1\/T0/);
  });
  it('a spectrum with decreasing frequencies throws AnalysisInputError', () => {
    const bad = { frequencyHz: Float64Array.of(1, 3, 2), psd: Float64Array.of(1, 1, 1) };
    expect(() => betaLine(bad, { observationTimeS: 1 })).toThrow(/increase strictly/);
  });
  it('a spectrum with a negative S_ν throws AnalysisInputError', () => {
    const bad = { frequencyHz: Float64Array.of(1, 2, 3), psd: Float64Array.of(1, -1, 1) };
    expect(() => betaLine(bad, { observationTimeS: 1 })).toThrow(/>= 0/);
  });
  it('a spectrum with unequal lengths throws AnalysisInputError', () => {
    const bad = { frequencyHz: Float64Array.of(1, 2, 3), psd: Float64Array.of(1, 1) };
    expect(() => betaLine(bad, { observationTimeS: 1 })).toThrow(/equal lengths/);
  });
});
