/**
 * Spurs: discrete lines standing above the fitted noise model (mains, pump, servo bumps).
 *
 * Usage:
 *   import { findSpurs } from '../analysis/noise/spurs';
 *   const model = fitNoiseModel(logSpectrum);
 *   const spurs = findSpurs(welchSpectrum, model);                 // use the linear Welch grid (resolution)
 *   spurs[0].frequencyHz; spurs[0].heightDb
 */

import type { Spectrum, Spur } from '../types';
import type { NoiseModelCoefficients } from './model-fit';

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

export function findSpurs(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions = {}): Spur[] {
  void spectrum;
  void model;
  void options;
  throw new Error('findSpurs: not implemented yet');
}
