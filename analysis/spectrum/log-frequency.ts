/**
 * Log-frequency S_ν estimate from 1/T0 to fs/2: a cascade of decimate-by-2 stages, each feeding a
 * Welch accumulator of the same segment length L, stitched onto one log-spaced grid.
 *
 * Usage:
 *   import { createLogFrequencyAccumulator } from '../analysis/spectrum/log-frequency';
 *   const acc = createLogFrequencyAccumulator({ sampleRateHz: 10e6, segmentLength: 4096, pointsPerDecade: 30 });
 *   acc.push(frequencyBlock); …
 *   const s = acc.result();   // LogFrequencySpectrum: frequencyHz, psd, averages, resolutionHz, stage, reliableFromHz
 */

import type { DetrendName, LogFrequencySpectrum, WindowName } from '../types';

export interface LogFrequencyOptions {
  sampleRateHz: number;
  /** L of every stage (default 4096) */
  segmentLength?: number;
  window?: WindowName;
  overlap?: number;
  detrend?: DetrendName;
  /** a stage serves frequencies from bin minBin up (default 4; METHODS 1.5) */
  minBin?: number;
  /** and only when it has at least this many segments (default 2) */
  minAverages?: number;
  /** geometric output bins per decade (default 30; 0 = every stitched Welch bin) */
  pointsPerDecade?: number;
}

export interface LogFrequencyAccumulator {
  push(x: ArrayLike<number>): void;
  result(): LogFrequencySpectrum;
  readonly samplesSeen: number;
}

export declare function createLogFrequencyAccumulator(options: LogFrequencyOptions): LogFrequencyAccumulator;
