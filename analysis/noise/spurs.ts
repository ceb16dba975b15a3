/**
 * Spurs: discrete lines standing above the fitted noise model (mains, pump, servo bumps).
 *
 * Usage:
 *   import { findSpurs } from '../analysis/noise/spurs';
 *   const model = fitNoiseModel(logSpectrum);
 *   const spurs = findSpurs(welchSpectrum, model);                 // use the linear Welch grid (resolution)
 *   spurs[0].frequencyHz; spurs[0].heightDb
 *
 * Rule: a grid point belongs to a spur when S_ν(f) > M(f)·10^(threshold/10), M = the fitted power-law
 * model S_ν = a₀ + a₋₁/f + a₋₂/f² (model-fit.ts), threshold 10 dB by default. Points above the
 * threshold no more than `mergeGapPoints` grid steps apart form one spur (a windowed line covers
 * several bins: a Hann window puts −6.02 dB in each neighbour of an on-bin line — F. J. Harris,
 * "On the use of windows for harmonic analysis with the discrete Fourier transform", Proc. IEEE
 * 66(1), 51–83 (1978)). Each spur reports its frequency (the highest point, refined by a parabola
 * through ln S_ν of it and its two neighbours when the grid is locally even) and its height
 * 10·log10(S_ν/M) at the highest point, dB above the model.
 * The threshold is far above Welch scatter: with K_eff averages a bin exceeds its mean by 10 dB with
 * probability P(χ²_{2K}/2K > 10) — e^−10 ≈ 4.5e−5 for K = 1, negligible for K >= 4.
 * Defaults: threshold 10 dB, band = the whole spectrum above 0 Hz, merge gap 2 points, at most 100
 * spurs (the highest kept), returned in increasing frequency.
 * Worked check: a line 20 dB above a flat model on bin 50 of a 1 Hz grid → one spur, 50 Hz, 20 dB.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum, Spur } from '../types';
import { checkSpectrum } from '../linewidth/spectrum-grid';
import { evaluateNoiseModel, type NoiseModelCoefficients } from './model-fit';

export interface SpurOptions {
  /** a point is part of a spur when S_ν > model · 10^(thresholdDb/10); default 10 dB */
  thresholdDb?: number;
  /** band [lo, hi] Hz searched; default the whole spectrum above 0 Hz */
  bandHz?: [number, number];
  /** points above the threshold closer than this many grid steps belong to the same spur; default 2 */
  mergeGapPoints?: number;
  /** keep at most this many (the highest); default 100 */
  maxSpurs?: number;
}

interface ResolvedSpurOptions {
  ratio: number;
  lowHz: number;
  highHz: number;
  mergeGapPoints: number;
  maxSpurs: number;
}

function resolveSpurOptions(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions): ResolvedSpurOptions {
  checkSpectrum(spectrum, 'findSpurs');
  for (const [name, v] of Object.entries({
    whiteHz2PerHz: model?.whiteHz2PerHz,
    flickerHz2: model?.flickerHz2,
    randomWalkHz3: model?.randomWalkHz3,
  })) {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
      throw new AnalysisInputError(`findSpurs: model.${name} must be a finite number >= 0, got ${v}`);
    }
  }
  if (model.whiteHz2PerHz + model.flickerHz2 + model.randomWalkHz3 <= 0) {
    throw new AnalysisInputError('findSpurs: the model is zero everywhere');
  }
  const thresholdDb = options.thresholdDb ?? 10;
  if (!Number.isFinite(thresholdDb) || thresholdDb <= 0) {
    throw new AnalysisInputError(`findSpurs: thresholdDb must be a positive number, got ${thresholdDb}`);
  }
  const f = spectrum.frequencyHz;
  let lowHz = 0;
  let highHz = f[f.length - 1];
  if (options.bandHz !== undefined) {
    const [lo, hi] = options.bandHz;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo < 0 || hi <= lo) {
      throw new AnalysisInputError(`findSpurs: bandHz must be [lo, hi] with 0 <= lo < hi, got [${lo}, ${hi}]`);
    }
    lowHz = lo;
    highHz = hi;
  }
  const mergeGapPoints = options.mergeGapPoints ?? 2;
  if (!Number.isInteger(mergeGapPoints) || mergeGapPoints < 1) {
    throw new AnalysisInputError(`findSpurs: mergeGapPoints must be a positive integer, got ${mergeGapPoints}`);
  }
  const maxSpurs = options.maxSpurs ?? 100;
  if (!Number.isInteger(maxSpurs) || maxSpurs < 1) {
    throw new AnalysisInputError(`findSpurs: maxSpurs must be a positive integer, got ${maxSpurs}`);
  }
  return { ratio: Math.pow(10, thresholdDb / 10), lowHz, highHz, mergeGapPoints, maxSpurs };
}

/** Frequency of the peak at i, refined by a parabola through ln S at i−1, i, i+1 on an even grid. */
function refinePeak(f: Float64Array, s: Float64Array, i: number): number {
  if (i === 0 || i === f.length - 1) return f[i];
  const h0 = f[i] - f[i - 1];
  const h1 = f[i + 1] - f[i];
  if (Math.abs(h0 - h1) > 1e-6 * h1 || !(s[i - 1] > 0 && s[i + 1] > 0 && s[i] > 0)) return f[i];
  const a = Math.log(s[i - 1]);
  const b = Math.log(s[i]);
  const c = Math.log(s[i + 1]);
  const den = a - 2 * b + c;
  if (!(den < 0)) return f[i];
  // vertex of the parabola through (−1, a), (0, b), (1, c): δ = (a − c) / (2(a − 2b + c)), |δ| <= ½
  const delta = (0.5 * (a - c)) / den;
  return f[i] + Math.max(-0.5, Math.min(0.5, delta)) * h1;
}

export function findSpurs(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions = {}): Spur[] {
  const o = resolveSpurOptions(spectrum, model, options);
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const spurs: Spur[] = [];
  let peakIndex = -1;
  let peakRatio = 0;
  let lastAbove = -Infinity;
  const close = () => {
    if (peakIndex >= 0) {
      spurs.push({ frequencyHz: refinePeak(f, s, peakIndex), heightDb: 10 * Math.log10(peakRatio) });
    }
    peakIndex = -1;
    peakRatio = 0;
  };
  for (let i = 0; i < f.length; i++) {
    if (!(f[i] > 0) || f[i] < o.lowHz || f[i] > o.highHz) continue;
    const m = evaluateNoiseModel(model, f[i]);
    const ratio = s[i] / m;
    if (!(ratio > o.ratio)) continue;
    if (i - lastAbove > o.mergeGapPoints) close();
    if (ratio > peakRatio) {
      peakRatio = ratio;
      peakIndex = i;
    }
    lastAbove = i;
  }
  close();
  if (spurs.length > o.maxSpurs) {
    const kept = [...spurs].sort((p, q) => q.heightDb - p.heightDb).slice(0, o.maxSpurs);
    return kept.sort((p, q) => p.frequencyHz - q.frequencyHz);
  }
  return spurs;
}
