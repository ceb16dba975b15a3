import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { whiteFloor } from '../../analysis/linewidth/white-floor';
import { linearSpectrum, logSpectrum, seededUniform, withWelchScatter } from '../fixtures/linewidth/spectra';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('whiteFloor(spectrum) finds the band automatically', () => {
  it('white h0 = 1e4 everywhere → floor 1e4 and intrinsic linewidth π·h0 = 31415.93 Hz (METHODS 3.2)', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, () => 1e4));
    expect(r.mode).toBe('auto');
    expect(r.valueHz2PerHz).toBeCloseTo(1e4, 8);
    expect(r.intrinsicLinewidthHz).toBeCloseTo(31415.93, 2);
    expect(r.slope).toBeCloseTo(0, 10);
    expect(r.warnings).toEqual([]);
  });

  it('h0 = 1e4 with flicker (corner 10 Hz) and an f² detection rise (corner 10 MHz) → h0 within 0.3 %', () => {
    // METHODS 3.2/2.6: S = h0 + h₋₁/f + c2 f²; the white term dominates between the corners
    const r = whiteFloor(logSpectrum(1, 1e8, 100, (f) => 1e4 + 1e5 / f + 1e-10 * f * f));
    expect(rel(r.valueHz2PerHz, 1e4)).toBeLessThan(3e-3);
    expect(r.bandHz[0]).toBeGreaterThan(100);
    expect(r.bandHz[1]).toBeLessThan(2e7);
  });

  it('h0 = 1e4 with flicker (corner 100 Hz) and f² rise (corner 1 MHz) → within 1 % (the valley minimum is 1.004·h0)', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, (f) => 1e4 + 1e6 / f + 1e-8 * f * f));
    expect(rel(r.valueHz2PerHz, 1e4)).toBeLessThan(1e-2);
    expect(r.valueHz2PerHz).toBeGreaterThanOrEqual(1.004e4 * (1 - 1e-9));
  });

  it('prefers the white floor to a higher flat relaxation-oscillation bump, with Welch scatter (K = 50): within 6 %', () => {
    // statistical tolerance: each point scatters by 1/√50 = 14 %; the band holds >= 50 points (σ <= 2 %): 3σ
    const clean = logSpectrum(1, 1e7, 100, (f) => 1e4 + 1e6 / f + 1e-8 * f * f + 3e5 * Math.exp(-((Math.log10(f) - 5.5) ** 2) / 0.01));
    const r = whiteFloor(withWelchScatter(clean, 50, 11));
    expect(rel(r.valueHz2PerHz, 1e4)).toBeLessThan(0.06);
    expect(r.bandHz[1]).toBeLessThan(2e5);
    expect(r.pointCount).toBeGreaterThanOrEqual(50);
  });

  it('leaves out a spur point standing 20 dB above its neighbours and says so', () => {
    const s = logSpectrum(1, 1e7, 100, () => 1e4);
    const k = s.frequencyHz.findIndex((f) => f >= 3e4);
    s.psd[k] = 1e6;
    const r = whiteFloor(s);
    expect(r.valueHz2PerHz).toBeCloseTo(1e4, 6);
    expect(r.warnings.join(' ')).toMatch(/left out as spurs/);
  });

  it('whiteFloor(s, { spurs }) leaves out the grid points next to a given spur', () => {
    const s = logSpectrum(1, 1e7, 100, () => 1e4);
    const k = s.frequencyHz.findIndex((f) => f >= 3e4);
    s.psd[k] = 3e4; // only 4.8 dB: not caught by the 10× rule
    const withSpur = whiteFloor(s, { spurs: [{ frequencyHz: s.frequencyHz[k], heightDb: 4.8 }] });
    expect(withSpur.valueHz2PerHz).toBeCloseTo(1e4, 6);
  });

  it('on a linear Welch grid (white + flicker, K = 20) searches up to top/5 = fs/10 and warns that flicker still adds', () => {
    // fs = 1 MHz, L = 2^16; h0 = 1e3, h₋₁ = 1e7 (corner 10 kHz): at 30–100 kHz flicker adds 10–30 %
    const welch = withWelchScatter(linearSpectrum(1e6 / 65536, 1, 32768, (f) => 1e3 + 1e7 / f), 20, 5);
    const r = whiteFloor(welch);
    expect(r.bandHz[1]).toBeLessThanOrEqual(1e5);
    expect(r.valueHz2PerHz).toBeGreaterThan(1e3);
    expect(r.valueHz2PerHz).toBeLessThan(1.3e3);
    expect(r.warnings.join(' ')).toMatch(/still has a log-log slope/);
  });

  it('warns "no band where the white term dominates" on pure flicker + f² noise', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, (f) => 1e6 / f + 1e-8 * f * f));
    expect(r.warnings.join(' ')).toMatch(/no band where the white term dominates/);
  });
});

/**
 * A log-frequency-like spectrum whose points carry their own averages, as the cascade's log view does:
 * each point is S(f)·χ²_{2K}/(2K) with K = kOf(f) (METHODS 1.3; χ²_2/2 is an exponential deviate, so the
 * mean of K of them is χ²_{2K}/(2K)), and `averages` holds the K.
 */
function cascadeLike(lo: number, hi: number, ppd: number, fn: (f: number) => number, kOf: (f: number) => number, seed: number) {
  const u = seededUniform(seed);
  const n = Math.round(Math.log10(hi / lo) * ppd) + 1;
  const frequencyHz = new Float64Array(n);
  const psd = new Float64Array(n);
  const averages = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const f = lo * Math.pow(hi / lo, i / (n - 1));
    const k = kOf(f);
    let sum = 0;
    for (let j = 0; j < k; j++) sum -= Math.log(u());
    frequencyHz[i] = f;
    psd[i] = (fn(f) * sum) / k;
    averages[i] = k;
  }
  return { frequencyHz, psd, averages };
}

describe('whiteFloor weighs each point by its averages (METHODS 1.3)', () => {
  // white h0 = 1e4 from 1 Hz to 500 kHz, K = max(1, 0.05 f): single points scatter by 100 % at the bottom
  // and by 0.2 % at the top. The lowest flat window is not drawn to a downward fluctuation of few averages.
  it.each([1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12])('seed %i: the floor is h0 within 2 % (the band holds ≥ 10⁵ averages: s.e. ≤ 0.3 %)', (seed) => {
    const s = cascadeLike(1, 5e5, 30, () => 1e4, (f) => Math.max(1, Math.round(0.05 * f)), seed);
    const r = whiteFloor(s, { minHz: 1 });
    expect(rel(r.valueHz2PerHz, 1e4)).toBeLessThan(0.02);
    expect(r.warnings).toEqual([]);
  });

  it('the mean over a given band is K-weighted: points (10, K = 1) and (20, K = 3) → 17.5', () => {
    const s = { frequencyHz: Float64Array.of(1, 2), psd: Float64Array.of(10, 20), averages: Float64Array.of(1, 3) };
    expect(whiteFloor(s, { bandHz: [1, 2] }).valueHz2PerHz).toBeCloseTo(17.5, 12);
  });

  it('an averages array of the wrong length throws AnalysisInputError', () => {
    const s = { ...logSpectrum(1, 1e7, 20, () => 1e4), averages: Float64Array.of(1, 2, 3) };
    expect(() => whiteFloor(s)).toThrow(/averages must have one value per point/);
  });
});

describe('whiteFloor(spectrum, { model }) subtracts the fitted flicker and random walk (METHODS 3.2)', () => {
  // fs = 1 MHz, L = 2^16, K = 20: h0 = 1e3, h₋₁ = 1e7 (corner 10 kHz): below fs/10 flicker adds 10–30 %
  const welch = withWelchScatter(linearSpectrum(1e6 / 65536, 1, 32768, (f) => 1e3 + 1e7 / f), 20, 5);

  it('with the model a₋₁ = 1e7 the floor is h0 = 1e3 within 1 % (the band mean of a₋₁/f is taken off), said in a note', () => {
    const r = whiteFloor(welch, { model: { flickerHz2: 1e7, randomWalkHz3: 0 } });
    expect(rel(r.valueHz2PerHz, 1e3)).toBeLessThan(0.01);
    expect(r.colouredHz2PerHz).toBeGreaterThan(0.05 * 1e3);
    expect(r.notes.join(' ')).toMatch(/flicker\/random-walk part, .* % of S_ν over the floor band .* was subtracted/);
    expect(r.warnings.join(' ')).not.toMatch(/still has a log-log slope/);
  });

  it('the random-walk term is subtracted too: S = 1e3 + 1e9/f² with a₋₂ = 1e9 → 1e3 within 1e-6 (exact data)', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, (f) => 1e3 + 1e9 / (f * f)), { model: { flickerHz2: 0, randomWalkHz3: 1e9 } });
    expect(rel(r.valueHz2PerHz, 1e3)).toBeLessThan(1e-6);
  });

  it('past 25 % of the level it warns that the floor rests on the model', () => {
    // corner 1e5 Hz on a 1 MHz grid: the search (≤ 200 kHz) never sees h0 dominate by 3×
    const s = logSpectrum(1, 1e6, 100, (f) => 1e3 + 1e8 / f);
    const r = whiteFloor(s, { model: { flickerHz2: 1e8, randomWalkHz3: 0 } });
    expect(r.warnings.join(' ')).toMatch(/rests on the noise model/);
    expect(rel(r.valueHz2PerHz, 1e3)).toBeLessThan(1e-3);
  });

  it('past 50 % nothing is subtracted: pure flicker reports the band mean as an upper bound, with a warning', () => {
    const s = logSpectrum(1, 1e6, 100, (f) => 1e6 / f);
    const r = whiteFloor(s, { model: { flickerHz2: 1e6, randomWalkHz3: 0 } });
    expect(r.colouredHz2PerHz).toBe(0);
    expect(r.valueHz2PerHz).toBeGreaterThan(0);
    expect(r.warnings.join(' ')).toMatch(/does not dominate anywhere .* an upper bound/);
  });

  it('a negative model coefficient throws AnalysisInputError', () => {
    expect(() => whiteFloor(welch, { model: { flickerHz2: -1, randomWalkHz3: 0 } })).toThrow(/model\.flickerHz2/);
  });
});

describe('whiteFloor(spectrum, { excludeHz }) leaves spans out of the search', () => {
  // white 1e4 with a flat dip to 5e3 over 2–20 kHz: the lowest flat band is the dip unless it is excluded
  const s = logSpectrum(1, 1e7, 100, (f) => (f >= 2e3 && f <= 2e4 ? 5e3 : 1e4));
  it('without exclusion the dip wins', () => {
    expect(whiteFloor(s).valueHz2PerHz).toBeCloseTo(5e3, 6);
  });
  it('with excludeHz [[1.5e3, 2.5e4]] the floor is 1e4 and no point of the span is used', () => {
    const r = whiteFloor(s, { excludeHz: [[1.5e3, 2.5e4]] });
    expect(r.valueHz2PerHz).toBeCloseTo(1e4, 6);
    expect(r.bandHz[1] < 1.5e3 || r.bandHz[0] > 2.5e4).toBe(true);
  });
  it('a reversed span throws AnalysisInputError', () => {
    expect(() => whiteFloor(s, { excludeHz: [[2.5e4, 1.5e3]] })).toThrow(/excluded span/);
  });
});

describe('whiteFloor(spectrum, { bandHz }) averages a given band', () => {
  it('is the mean of linear values, not of dB: S = [10, 20, 30, 40, 50] on [2, 4] Hz → 30 (a dB mean would read 28.8)', () => {
    const s = { frequencyHz: Float64Array.of(1, 2, 3, 4, 5), psd: Float64Array.of(10, 20, 30, 40, 50) };
    const r = whiteFloor(s, { bandHz: [2, 4] });
    expect(r.mode).toBe('band');
    expect(r.valueHz2PerHz).toBe(30);
    expect(r.bandHz).toEqual([2, 4]);
    expect(r.pointCount).toBe(3);
    expect(r.intrinsicLinewidthHz).toBeCloseTo(30 * Math.PI, 12);
  });

  it('white h0 = 1e4 over [1e4, 1e5] Hz → π·h0 = 31415.93 Hz', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, () => 1e4), { bandHz: [1e4, 1e5] });
    expect(r.intrinsicLinewidthHz).toBeCloseTo(31415.93, 2);
  });

  it('warns when the given band is dominated by flicker (log-log slope −1)', () => {
    const r = whiteFloor(logSpectrum(1, 1e7, 100, (f) => 1e4 + 1e6 / f), { bandHz: [1, 10] });
    expect(r.slope).toBeLessThan(-0.9);
    expect(r.warnings.join(' ')).toMatch(/white term does not dominate/);
  });
});

describe('whiteFloor rejects bad options', () => {
  const s = logSpectrum(1, 1e7, 20, () => 1e4);
  it('bandHz = [5, 1] throws AnalysisInputError', () => {
    expect(() => whiteFloor(s, { bandHz: [5, 1] })).toThrow(AnalysisInputError);
  });
  it('a band holding no grid point throws AnalysisInputError', () => {
    const sparse = { frequencyHz: Float64Array.of(1, 10, 100), psd: Float64Array.of(1, 1, 1) };
    expect(() => whiteFloor(sparse, { bandHz: [2, 3] })).toThrow(/holds no grid point/);
  });
  it('windowDecades = 0.2 throws AnalysisInputError', () => {
    expect(() => whiteFloor(s, { windowDecades: 0.2 })).toThrow(/windowDecades/);
  });
  it('maxHz below minHz throws AnalysisInputError', () => {
    expect(() => whiteFloor(s, { minHz: 100, maxHz: 10 })).toThrow(/maxHz/);
  });
  it('a spur without a finite frequency throws AnalysisInputError', () => {
    expect(() => whiteFloor(s, { spurs: [{ frequencyHz: Number.NaN, heightDb: 20 }] })).toThrow(/spur/);
  });
  it('a spectrum of one point throws AnalysisInputError', () => {
    expect(() => whiteFloor({ frequencyHz: Float64Array.of(1), psd: Float64Array.of(1) })).toThrow(/at least 2 points/);
  });
});
