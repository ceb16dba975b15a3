import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { fitNoiseModel } from '../../analysis/noise/model-fit';
import { findSpurs } from '../../analysis/noise/spurs';
import type { Spectrum } from '../../analysis/types';
import { linearSpectrum, withWelchScatter } from '../fixtures/linewidth/spectra';

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
});
