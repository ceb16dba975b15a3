import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { fitNoiseModel } from '../../analysis/noise/model-fit';
import { addLineBlocks, findSpectralFeatures, findSpurs, removeLines } from '../../analysis/noise/spurs';
import type { Spectrum } from '../../analysis/types';
import { linearSpectrum, withWelchScatter } from '../fixtures/linewidth/spectra';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const model = { whiteHz2PerHz: 1e4, flickerHz2: 1e6, randomWalkHz3: 0 };
const modelAt = (f: number) => model.whiteHz2PerHz + model.flickerHz2 / f;

/**
 * Welch-like spectrum on a 1 Hz grid (fs = 2048 Hz, L = 2048, bins 1..1024) with K = 50 averages, plus
 * Hann-windowed lines. A periodic Hann window's kernel is |W(δ)|² ∝ [sinc(δ)/(1 − δ²)]² at δ bins from
 * the line (Harris, Proc. IEEE 66(1), 51 (1978)): an on-bin line puts 1/4 (−6.02 dB) in each neighbour.
 */
function welchWithLines(lines: { hz: number; db: number }[], seed = 3): Spectrum {
  const noisy = withWelchScatter(linearSpectrum(1, 1, 1024, modelAt), 50, seed);
  const psd = Float64Array.from(noisy.psd);
  for (const line of lines) {
    const peak = modelAt(line.hz) * Math.pow(10, line.db / 10);
    for (let m = Math.floor(line.hz) - 3; m <= Math.ceil(line.hz) + 3; m++) {
      const d = m - line.hz;
      const sinc = Math.abs(d) < 1e-12 ? 1 : Math.sin(Math.PI * d) / (Math.PI * d);
      const kernel = Math.abs(Math.abs(d) - 1) < 1e-12 ? 0.5 : sinc / (1 - d * d);
      psd[m - 1] += peak * kernel * kernel;
    }
  }
  return { frequencyHz: noisy.frequencyHz, psd };
}

describe('findSpurs(welch, model)', () => {
  it('finds a 50 Hz line 20 dB above the model: frequency within half a bin, height 20 ± 1 dB', () => {
    const spurs = findSpurs(welchWithLines([{ hz: 50, db: 20 }]), model);
    expect(spurs).toHaveLength(1);
    expect(Math.abs(spurs[0].frequencyHz - 50)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(spurs[0].heightDb - 20)).toBeLessThanOrEqual(1);
  });

  it('groups the −6 dB Hann neighbours of an on-bin line into the same spur', () => {
    // neighbours at 20 − 6.02 = 14 dB are above the 10 dB threshold but belong to the 50 Hz line
    const s = welchWithLines([{ hz: 50, db: 20 }]);
    expect(10 * Math.log10(s.psd[48] / modelAt(49))).toBeGreaterThan(10);
    expect(findSpurs(s, model)).toHaveLength(1);
  });

  it('finds an off-bin line (50.3 Hz) within half a bin', () => {
    const spurs = findSpurs(welchWithLines([{ hz: 50.3, db: 25 }]), model);
    expect(spurs).toHaveLength(1);
    expect(Math.abs(spurs[0].frequencyHz - 50.3)).toBeLessThanOrEqual(0.5);
  });

  it('finds no spurs on a clean Welch spectrum (K = 50: a 10 dB excursion is out of reach)', () => {
    expect(findSpurs(welchWithLines([]), model)).toEqual([]);
  });

  it('returns separate lines in increasing frequency: 50, 150 and 400 Hz', () => {
    const spurs = findSpurs(welchWithLines([{ hz: 400, db: 15 }, { hz: 50, db: 20 }, { hz: 150, db: 30 }]), model);
    expect(spurs.map((s) => Math.round(s.frequencyHz))).toEqual([50, 150, 400]);
    expect(spurs.map((s) => Math.round(s.heightDb))).toEqual([20, 30, 15]);
  });

  it('findSpurs(s, m, { maxSpurs: 1 }) keeps the highest', () => {
    const spurs = findSpurs(welchWithLines([{ hz: 50, db: 20 }, { hz: 150, db: 30 }]), model, { maxSpurs: 1 });
    expect(spurs).toHaveLength(1);
    expect(Math.round(spurs[0].frequencyHz)).toBe(150);
  });

  it('findSpurs(s, m, { thresholdDb: 25 }) ignores a 20 dB line', () => {
    expect(findSpurs(welchWithLines([{ hz: 50, db: 20 }]), model, { thresholdDb: 25 })).toEqual([]);
  });

  it('findSpurs(s, m, { bandHz: [100, 500] }) searches only the band', () => {
    const spurs = findSpurs(welchWithLines([{ hz: 50, db: 20 }, { hz: 150, db: 30 }]), model, { bandHz: [100, 500] });
    expect(spurs.map((s) => Math.round(s.frequencyHz))).toEqual([150]);
  });

  it('works with a model fitted to the same spectrum: the fit leaves the line out, the line reads 20 ± 1 dB', () => {
    const s = welchWithLines([{ hz: 50, db: 20 }]);
    const fitted = fitNoiseModel(s);
    expect(fitted.excludedCount).toBeGreaterThanOrEqual(1);
    const spurs = findSpurs(s, fitted);
    expect(spurs).toHaveLength(1);
    expect(Math.abs(spurs[0].heightDb - 20)).toBeLessThanOrEqual(1);
  });
});

/**
 * Kernel |W(δ)|²/|W(0)|² of a periodic cosine-sum window w[n] = Σ (−1)^k a_k cos(2πkn/L) at δ bins from a
 * line, by a direct DFT of the window (L = 256). Blackman–Harris 4-term a = 0.35875, 0.48829, 0.14128,
 * 0.01168 (Harris, Proc. IEEE 66(1), 51 (1978)).
 */
function cosineSumKernel(a: number[], delta: number): number {
  const L = 256;
  let re0 = 0;
  let re = 0;
  let im = 0;
  for (let n = 0; n < L; n++) {
    let w = 0;
    for (let k = 0; k < a.length; k++) w += (k % 2 === 0 ? 1 : -1) * a[k] * Math.cos((2 * Math.PI * k * n) / L);
    re0 += w;
    re += w * Math.cos((2 * Math.PI * delta * n) / L);
    im -= w * Math.sin((2 * Math.PI * delta * n) / L);
  }
  return (re * re + im * im) / (re0 * re0);
}

/** A resonance-like bump of peak P over the model, full width at half maximum W: P/(1 + (2(f − f0)/W)²) (Lorentzian). */
function withBump(spectrum: Spectrum, f0: number, width: number, peakOverModel: number): Spectrum {
  const psd = Float64Array.from(spectrum.psd);
  for (let i = 0; i < psd.length; i++) {
    const f = spectrum.frequencyHz[i];
    const x = (2 * (f - f0)) / width;
    psd[i] += (peakOverModel * modelAt(f0)) / (1 + x * x);
  }
  return { frequencyHz: spectrum.frequencyHz, psd };
}

describe('findSpectralFeatures(welch, model) tells narrow lines from broad bumps', () => {
  it('a Lorentzian bump (FWHM 40 bins, 25 dB over the model, K = 14) is one bump, not spurs: centre within 2 bins, width within 15 %', () => {
    // K = 14: single bins scatter by ±27 %, so the skirts cross the 10 dB threshold in patches
    const clean = withBump(linearSpectrum(1, 1, 1024, modelAt), 600, 40, Math.pow(10, 2.5));
    const s = withWelchScatter(clean, 14, 7);
    const { spurs, bumps } = findSpectralFeatures(s, model);
    expect(spurs).toEqual([]);
    expect(bumps).toHaveLength(1);
    expect(Math.abs(bumps[0].centerHz - 600)).toBeLessThanOrEqual(2);
    expect(rel(bumps[0].widthHz, 40)).toBeLessThan(0.15);
    expect(Math.abs(bumps[0].heightDb - 25)).toBeLessThan(1.5);
    // findSpurs reports the lines only
    expect(findSpurs(s, model)).toEqual([]);
  });

  it('a 30 dB line on top of the bump is still a spur, and the bump stays one bump', () => {
    const bumped = withBump(linearSpectrum(1, 1, 1024, modelAt), 600, 40, Math.pow(10, 2.5));
    const lines = welchWithLines([{ hz: 580, db: 42 }], 8);
    const psd = Float64Array.from(bumped.psd, (v, i) => v + lines.psd[i] - modelAt(i + 1));
    const { spurs, bumps } = findSpectralFeatures(withWelchScatter({ frequencyHz: bumped.frequencyHz, psd }, 50, 9), model);
    expect(spurs.map((x) => Math.round(x.frequencyHz))).toEqual([580]);
    expect(bumps).toHaveLength(1);
    expect(Math.abs(bumps[0].centerHz - 600)).toBeLessThanOrEqual(3);
  });

  it('a line reports its power Σ(S − M)·Δf over the main lobe: an off-bin Hann line 25 dB up carries 1.5 bins × its on-bin peak', () => {
    // the Hann kernel summed over all bins is its ENBW, 1.5 bins (METHODS 1.2), whatever the offset
    const [spur] = findSpurs(welchWithLines([{ hz: 50.3, db: 25 }]), model);
    const expected = 1.5 * modelAt(50.3) * Math.pow(10, 2.5) * 1; // 1 Hz bins
    expect(rel(spur.powerHz2, expected)).toBeLessThan(0.02);
  });

  it("a flat-top line (main lobe ±5 bins) is one spur when the spectrum names its window, its power summed over that lobe", () => {
    // the 5-term flat-top of scipy.signal.windows.flattop (METHODS 1.2: NENBW 3.7702 bins)
    const flatTop = [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368];
    const clean = linearSpectrum(1, 1, 1024, modelAt);
    const psd = Float64Array.from(clean.psd);
    const peak = modelAt(300) * 1e3; // 30 dB
    for (let mBin = 285; mBin <= 315; mBin++) psd[mBin - 1] += peak * cosineSumKernel(flatTop, mBin - 300.4);
    const s = withWelchScatter({ frequencyHz: clean.frequencyHz, psd }, 50, 4);
    const named = findSpectralFeatures({ ...s, window: 'flat-top' } as Spectrum, model);
    expect(named.spurs).toHaveLength(1);
    // the flat top reads the frequency to about a bin (its lobe is flat over ±1 bin)
    expect(Math.abs(named.spurs[0].frequencyHz - 300.4)).toBeLessThanOrEqual(1);
    expect(named.bumps).toEqual([]);
    expect(findSpectralFeatures(s, model, { window: 'flat-top' }).spurs).toHaveLength(1);
    // its power over the ±5-bin lobe: the window's ENBW in bins × the on-bin peak
    expect(rel(named.spurs[0].powerHz2, 3.7702 * peak)).toBeLessThan(0.02);
    // summed over Hann's ±2.5 bins instead, the power misses the flat top's outer lobe (−9 dB at 2.6 bins)
    expect(findSpurs(s, model)[0].powerHz2).toBeLessThan(0.95 * 3.7702 * peak);
  });
});

/** ∫S df read linearly between the points (trapezoid rule) */
function trapezoid(sp: Spectrum): number {
  let a = 0;
  for (let i = 0; i + 1 < sp.frequencyHz.length; i++) {
    a += 0.5 * (sp.psd[i] + sp.psd[i + 1]) * (sp.frequencyHz[i + 1] - sp.frequencyHz[i]);
  }
  return a;
}

describe('removeLines and addLineBlocks count a line once, with its measured power', () => {
  it('removeLines replaces the ±2.5-bin Hann footprint by the straight line between its neighbours', () => {
    const s = welchWithLines([{ hz: 300.4, db: 30 }], 12);
    const clean = removeLines(s, [{ frequencyHz: 300.4 }]);
    // bins 298..302 (|m − 300.4| <= 2.5) lie between bins 297 and 303
    for (let m = 298; m <= 302; m++) {
      const expected = s.psd[296] + ((s.psd[302] - s.psd[296]) * (m - 297)) / 6;
      expect(clean.psd[m - 1]).toBeCloseTo(expected, 9);
    }
    expect(clean.psd[296]).toBe(s.psd[296]);
    expect(clean.psd[302]).toBe(s.psd[302]);
    expect(clean.frequencyHz).toBe(s.frequencyHz);
  });

  it('removeLines reads each point’s own resolution: a coarser-stage bin holding the line’s leakage is taken out too', () => {
    // a stitched grid: 1 Hz bins up to 60 Hz, then 4 Hz bins (a shallower stage); a line at 58.6 Hz fills
    // the fine bins 57–60 and leaks into the coarse 64 and 68 Hz bins (within 2.5 × 4 Hz of the line)
    const f = [...Array.from({ length: 60 }, (_, i) => i + 1), ...Array.from({ length: 20 }, (_, i) => 64 + 4 * i)];
    const resolutionHz = Float64Array.from(f, (x) => (x <= 60 ? 1 : 4));
    const psd = Float64Array.from(f, (x) => (x >= 57 && x <= 60 ? 1e3 : x === 64 || x === 68 ? 50 : x === 56 ? 7 : 1));
    const clean = removeLines({ frequencyHz: Float64Array.from(f), psd, resolutionHz } as Spectrum, [{ frequencyHz: 58.6 }]);
    const at = (x: number) => clean.psd[f.indexOf(x)];
    // 56 Hz is 2.6 fine bins away: kept; the footprint 57…68 Hz runs straight from 7 (56 Hz) to 1 (72 Hz)
    expect(at(56)).toBe(7);
    expect(at(72)).toBe(1);
    for (const x of [57, 58, 59, 60, 64, 68]) expect(at(x)).toBeCloseTo(7 + ((1 - 7) * (x - 56)) / 16, 12);
  });

  it('addLineBlocks adds exactly P to ∫S df (read linearly), as a block P/w wide w at the line', () => {
    const base = linearSpectrum(1, 1, 1024, modelAt);
    const blocked = addLineBlocks(base, [{ frequencyHz: 300.4, powerHz2: 5e6, resolutionHz: 1 }]);
    // the block's edges rise over 1e-6 of its width: 1e-6 of P
    expect(rel(trapezoid(blocked) - trapezoid(base), 5e6)).toBeLessThan(2e-6);
    const k = blocked.frequencyHz.findIndex((x) => x >= 299.9);
    expect(blocked.frequencyHz[k]).toBeCloseTo(299.9, 9);
    expect(blocked.psd[k] - modelAt(299.9)).toBeCloseTo(5e6, -2);
  });

  it('addLineBlocks keeps P for a line half a bin from the top of the grid (the block narrows)', () => {
    const base = linearSpectrum(1, 1, 1024, modelAt);
    const blocked = addLineBlocks(base, [{ frequencyHz: 1023.8, powerHz2: 5e6, resolutionHz: 2 }]);
    expect(rel(trapezoid(blocked) - trapezoid(base), 5e6)).toBeLessThan(2e-6);
    expect(blocked.frequencyHz[blocked.frequencyHz.length - 1]).toBe(1024);
  });

  it('remove then add: ∫S df of a Welch line spectrum keeps the background plus the line power Σ(S − M)·r', () => {
    const s = welchWithLines([{ hz: 300.4, db: 30 }], 13);
    const [line] = findSpurs(s, model);
    const rebuilt = addLineBlocks(removeLines(s, [line]), [line]);
    // the line's power is 1.5 bins × its on-bin peak (Hann ENBW, METHODS 1.2)
    const power = 1.5 * modelAt(300.4) * 1e3;
    expect(rel(trapezoid(rebuilt) - trapezoid(removeLines(s, [line])), power)).toBeLessThan(0.02);
  });
});

describe('findSpurs rejects bad options', () => {
  const s = linearSpectrum(1, 1, 64, modelAt);
  it('thresholdDb = 0 throws AnalysisInputError', () => {
    expect(() => findSpurs(s, model, { thresholdDb: 0 })).toThrow(AnalysisInputError);
  });
  it('a negative model coefficient throws AnalysisInputError', () => {
    expect(() => findSpurs(s, { ...model, flickerHz2: -1 })).toThrow(/model\.flickerHz2/);
  });
  it('a model that is zero everywhere throws AnalysisInputError', () => {
    expect(() => findSpurs(s, { whiteHz2PerHz: 0, flickerHz2: 0, randomWalkHz3: 0 })).toThrow(/zero everywhere/);
  });
  it('bandHz = [10, 5] throws AnalysisInputError', () => {
    expect(() => findSpurs(s, model, { bandHz: [10, 5] })).toThrow(/bandHz/);
  });
  it('mergeGapPoints = 0 throws AnalysisInputError', () => {
    expect(() => findSpurs(s, model, { mergeGapPoints: 0 })).toThrow(/mergeGapPoints/);
  });
  it('maxSpurs = 0 throws AnalysisInputError', () => {
    expect(() => findSpurs(s, model, { maxSpurs: 0 })).toThrow(/maxSpurs/);
  });
  it("window = 'kaiser' throws AnalysisInputError", () => {
    expect(() => findSpurs(s, model, { window: 'kaiser' as never })).toThrow(/window must be one of/);
  });
});
