/**
 * Reduce a spectrum to a few points per decade for display: geometric bins, mean of linear values.
 *
 * Usage:
 *   import { logBinSpectrum } from '../analysis/spectrum/log-binning';
 *   const d = logBinSpectrum(s, { pointsPerDecade: 30 });     // or { points: 400 }
 *   // d.frequencyHz, d.psd, d.counts (input points behind each output point)
 *
 * Bin edges are f_lo·10^(i/ppd) from the lowest positive input frequency; every input point with
 * f > 0 falls in exactly one bin; empty bins are dropped (so at low f, where input points are sparser
 * than the bins, each point passes through unchanged). An output point is the arithmetic mean of the
 * member frequencies and of the member PSD values (linear, never dB — averaging dB would bias low).
 * `points` asks for about that many bins over the input's decades instead of a per-decade density.
 * f = 0 is dropped. Common practice, no source.
 * Worked check: f = 1, 2, …, 1000 Hz with PSD ≡ 2, 10 per decade → every point 2, counts summing to 1000,
 *   and the points below 5 Hz are the input points themselves (one per bin).
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

export interface LogBinOptions {
  pointsPerDecade?: number;
  points?: number;
}

export interface LogBinnedSpectrum extends Spectrum {
  counts: Uint32Array;
}

export function logBinSpectrum(spectrum: Spectrum, options: LogBinOptions = {}): LogBinnedSpectrum {
  const { frequencyHz: f, psd } = spectrum;
  if (f.length !== psd.length) {
    throw new AnalysisInputError(`frequency and PSD lengths differ (${f.length} vs ${psd.length})`);
  }
  if (options.pointsPerDecade !== undefined && options.points !== undefined) {
    throw new AnalysisInputError('give pointsPerDecade or points, not both');
  }
  let lo = Infinity;
  let hi = 0;
  for (let i = 0; i < f.length; i++) {
    if (i > 0 && !(f[i] >= f[i - 1])) throw new AnalysisInputError(`frequencies must be ascending (at index ${i})`);
    if (f[i] > 0) {
      if (f[i] < lo) lo = f[i];
      if (f[i] > hi) hi = f[i];
    }
  }
  let ppd: number;
  if (options.points !== undefined) {
    if (!Number.isInteger(options.points) || options.points < 1) {
      throw new AnalysisInputError(`points must be an integer >= 1, got ${options.points}`);
    }
    const decades = hi > lo ? Math.log10(hi / lo) : 1;
    ppd = options.points / Math.max(decades, 1e-9);
  } else {
    ppd = options.pointsPerDecade ?? 30;
    if (!(Number.isFinite(ppd) && ppd > 0)) {
      throw new AnalysisInputError(`pointsPerDecade must be a positive number, got ${ppd}`);
    }
  }
  const outF: number[] = [];
  const outP: number[] = [];
  const counts: number[] = [];
  let current = -1;
  let sf = 0;
  let sp = 0;
  let c = 0;
  const flush = (): void => {
    if (c > 0) {
      outF.push(sf / c);
      outP.push(sp / c); // mean of linear values
      counts.push(c);
    }
    sf = 0;
    sp = 0;
    c = 0;
  };
  for (let i = 0; i < f.length; i++) {
    if (!(f[i] > 0)) continue;
    // bin index of f: ⌊ppd·log10(f/lo)⌋ (a tiny tolerance keeps exact edges in the upper bin)
    const bin = Math.floor(ppd * Math.log10(f[i] / lo) + 1e-9);
    if (bin !== current) {
      flush();
      current = bin;
    }
    sf += f[i];
    sp += psd[i];
    c++;
  }
  flush();
  return { frequencyHz: Float64Array.from(outF), psd: Float64Array.from(outP), counts: Uint32Array.from(counts) };
}
