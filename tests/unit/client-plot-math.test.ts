import { describe, expect, it } from 'vitest';
import {
  bandMean,
  betaSeparation,
  fromView,
  groupSpurs,
  nearestIndexLog,
  noiseModelCurve,
  regionsAboveBeta,
  seriesInView,
  toView,
  VIEWS,
} from '../../src/components/plots/spectrum-math';

/** A log grid of n frequencies over [lo, hi] Hz. */
function logGrid(lo: number, hi: number, n: number): number[] {
  return Array.from({ length: n }, (_, i) => lo * (hi / lo) ** (i / (n - 1)));
}

const C = (8 * Math.LN2) / (Math.PI * Math.PI);

describe('toView', () => {
  it("toView('dbc', 1 MHz, 1e4) is −83.01 dBc/Hz (L = 10·log10(S_ν/f²/2), IEEE Std 1139 definition)", () => {
    // S_φ = 1e4 / 1e12 = 1e-8 rad²/Hz; L = 10·log10(0.5e-8) = −83.0103 dB
    expect(toView('phase', 1e6, 1e4)).toBeCloseTo(1e-8, 20);
    expect(toView('dbc', 1e6, 1e4)).toBeCloseTo(-83.0103, 4);
  });

  it("toView('asd', f, 1e4) is 100 Hz/√Hz", () => {
    expect(toView('asd', 123, 1e4)).toBe(100);
  });

  it('fromView inverts toView in every view', () => {
    for (const view of VIEWS) {
      for (const [f, s] of [
        [3.7, 2.5e6],
        [1e5, 12.5],
      ]) {
        expect(fromView(view, f, toView(view, f, s)) / s).toBeCloseTo(1, 12);
      }
    }
  });

  it('seriesInView drops f = 0 and non-positive values on log axes', () => {
    const out = seriesInView({ frequencyHz: [0, 1, 2, 3], sNu: [5, 4, 0, 9] }, 'frequency');
    expect(out).toEqual({ f: [1, 3], v: [4, 9] });
  });
});

describe('bandMean', () => {
  it('bandMean of a white floor S_ν = 1e4 Hz²/Hz gives the intrinsic linewidth π·1e4 = 31415.93 Hz (Lorentzian FWHM)', () => {
    const f = logGrid(1, 1e6, 200);
    const r = bandMean({ frequencyHz: f, sNu: f.map(() => 1e4) }, [1e3, 1e5]);
    expect(r.meanHz2PerHz).toBe(1e4);
    expect(r.intrinsicLinewidthHz).toBeCloseTo(31415.93, 2);
  });

  it('bandMean averages the linear values with lo ≤ f ≤ hi only, whichever order the edges come in', () => {
    const series = { frequencyHz: [1, 10, 100, 1000], sNu: [7, 2, 4, 100] };
    const r = bandMean(series, [100, 10]);
    expect(r.pointCount).toBe(2);
    expect(r.meanHz2PerHz).toBe(3);
  });

  it('bandMean over a band with no point gives NaN and a count of 0', () => {
    const r = bandMean({ frequencyHz: [1, 10], sNu: [1, 1] }, [2, 3]);
    expect(r.pointCount).toBe(0);
    expect(r.intrinsicLinewidthHz).toBeNaN();
  });
});

describe('regionsAboveBeta', () => {
  it('betaSeparation(f) is 8 ln2 · f/π² (Di Domenico et al., Appl. Opt. 49, 4801, 2010)', () => {
    expect(betaSeparation(1e4)).toBeCloseTo(C * 1e4, 9);
  });

  it('a white floor h₀ = 1e4 stands above β up to f_x = π²h₀/(8 ln2) = 1.780e4 Hz', () => {
    const f = logGrid(1, 1e6, 301);
    const regions = regionsAboveBeta({ frequencyHz: f, sNu: f.map(() => 1e4) });
    expect(regions).toHaveLength(1);
    const r = regions[0];
    expect(r.frequencyHz[0]).toBe(1);
    const fx = r.frequencyHz[r.frequencyHz.length - 1];
    expect(fx).toBeCloseTo((Math.PI * Math.PI * 1e4) / (8 * Math.LN2), 6);
    expect(fx).toBeCloseTo(1.78e4, -2);
    // the region ends on the β-line itself
    expect(r.sNu[r.sNu.length - 1] / r.beta[r.beta.length - 1]).toBeCloseTo(1, 9);
  });

  it('white + flicker S_ν = 1e4 + 1e8/f crosses β at f_x = [h₀ + √(h₀² + 4c·h₋₁)]/(2c) = 2.494e4 Hz', () => {
    // closed form for a single crossing of h₀ + h₋₁/f with c·f, c = 8 ln2/π² (Di Domenico et al. 2010)
    const h0 = 1e4;
    const h1 = 1e8;
    const exact = (h0 + Math.sqrt(h0 * h0 + 4 * C * h1)) / (2 * C);
    const f = logGrid(1, 1e6, 400);
    const regions = regionsAboveBeta({ frequencyHz: f, sNu: f.map((x) => h0 + h1 / x) });
    const r = regions[0];
    const fx = r.frequencyHz[r.frequencyHz.length - 1];
    expect(exact).toBeCloseTo(2.494e4, -1);
    // power-law interpolation between grid points 1.5 % apart: within 0.1 %
    expect(Math.abs(fx / exact - 1)).toBeLessThan(1e-3);
  });

  it('regionsAboveBeta(series, 1/T₀) starts the first region exactly at 1/T₀', () => {
    const f = logGrid(1, 1e6, 61);
    const regions = regionsAboveBeta({ frequencyHz: f, sNu: f.map(() => 1e4) }, 123.4);
    expect(regions[0].frequencyHz[0]).toBeCloseTo(123.4, 9);
    expect(regions[0].sNu[0]).toBeCloseTo(1e4, 6);
    expect(regions[0].frequencyHz.every((x) => x >= 123.4 - 1e-9)).toBe(true);
  });

  it('a spur standing above β high up gives a second region', () => {
    const f = logGrid(1, 1e6, 401);
    const sNu = f.map((x) => (Math.abs(Math.log10(x / 2e5)) < 0.02 ? 1e7 : 1e3));
    const regions = regionsAboveBeta({ frequencyHz: f, sNu });
    expect(regions).toHaveLength(2);
    expect(regions[1].frequencyHz[0]).toBeGreaterThan(1.7e5);
    expect(regions[1].frequencyHz[regions[1].frequencyHz.length - 1]).toBeLessThan(2.3e5);
  });

  it('a spectrum everywhere below β has no region', () => {
    const f = logGrid(10, 1e6, 50);
    expect(regionsAboveBeta({ frequencyHz: f, sNu: f.map((x) => 0.1 * C * x) })).toEqual([]);
  });
});

describe('noiseModelCurve and nearestIndexLog', () => {
  it('noiseModelCurve evaluates a₀ + a₋₁/f + a₋₂/f² on a log grid over the range', () => {
    const c = noiseModelCurve({ whiteHz2PerHz: 100, flickerHz2: 1e4, randomWalkHz3: 1e6 }, [10, 1e4], 4);
    expect(c.frequencyHz.map((x) => Math.round(x))).toEqual([10, 100, 1000, 10000]);
    // at 100 Hz: 100 + 1e4/100 + 1e6/1e4 = 300
    expect(c.sNu[1]).toBeCloseTo(300, 9);
  });

  it('nearestIndexLog picks the nearer point in ratio, not in hertz', () => {
    // 30 is 3× above 10 and 3.3× below 100: nearer to 10 on a log axis
    expect(nearestIndexLog([10, 100], 30)).toBe(0);
    // 40: 4× above 10, 2.5× below 100 → 100, although 40 − 10 = 30 < 60 = 100 − 40
    expect(nearestIndexLog([10, 100], 40)).toBe(1);
    expect(nearestIndexLog([], 40)).toBe(-1);
  });
});

describe('groupSpurs', () => {
  it('groupSpurs puts lines within 10 % of their neighbour into one group marked at its highest line', () => {
    const groups = groupSpurs([
      { frequencyHz: 219e3, heightDb: 11 },
      { frequencyHz: 50, heightDb: 19 },
      { frequencyHz: 214e3, heightDb: 10.1 },
      { frequencyHz: 224e3, heightDb: 10.2 },
      { frequencyHz: 100, heightDb: 8 },
    ]);
    expect(groups).toEqual([
      { frequencyHz: 50, heightDb: 19, count: 1, loHz: 50, hiHz: 50 },
      { frequencyHz: 100, heightDb: 8, count: 1, loHz: 100, hiHz: 100 },
      { frequencyHz: 219e3, heightDb: 11, count: 3, loHz: 214e3, hiHz: 224e3 },
    ]);
  });
});
