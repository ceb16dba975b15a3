/**
 * Power-law noise model S_ν = a₀ + a₋₁/f + a₋₂/f² fitted to a frequency-noise PSD, and its 1/f corner.
 *
 * Usage:
 *   import { fitNoiseModel, evaluateNoiseModel } from '../analysis/noise/model-fit';
 *   const m = fitNoiseModel(logSpectrum);                          // whole band of the spectrum
 *   const m2 = fitNoiseModel(logSpectrum, { bandHz: [10, 1e5] });
 *   m.whiteHz2PerHz; m.flickerHz2; m.randomWalkHz3; m.cornerHz; evaluateNoiseModel(m, 50)
 */

import type { NoiseModel, NoiseModelFit, Spectrum } from '../types';

export interface NoiseModelCoefficients {
  whiteHz2PerHz: number;
  flickerHz2: number;
  randomWalkHz3: number;
}

export interface NoiseModelFitOptions {
  /** band [lo, hi] Hz; default the whole spectrum above 0 Hz */
  bandHz?: [number, number];
  /** starting coefficients (first weights 1/M²); default weights from the data */
  initial?: NoiseModelCoefficients;
  /** points standing more than this many dB above the model are left out (spurs); default 10 */
  spurThresholdDb?: number;
  /** iteration cap of the reweighting; default 100 */
  maxIterations?: number;
}

/** S_ν(f) of a model, Hz²/Hz. */
export function evaluateNoiseModel(model: NoiseModelCoefficients, frequencyHz: number): number {
  return model.whiteHz2PerHz + model.flickerHz2 / frequencyHz + model.randomWalkHz3 / (frequencyHz * frequencyHz);
}

export function fitNoiseModel(spectrum: Spectrum, options: NoiseModelFitOptions = {}): NoiseModelFit {
  void spectrum;
  void options;
  throw new Error('fitNoiseModel: not implemented yet');
}

export type { NoiseModel };
