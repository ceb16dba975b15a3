import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { whiteFloor } from '../../analysis/linewidth/white-floor';
import { linearSpectrum, logSpectrum, withWelchScatter } from '../fixtures/linewidth/spectra';

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
