/**
 * Frequency stage: one capture kind in, instantaneous-frequency samples (Hz) out, streaming.
 *
 * Usage:
 *   import { createFrequencyStage } from '../analysis/phase/frequency-stage';
 *   const stage = createFrequencyStage({ kind: 'iq', sampleRateHz: 10e6 });
 *   for (const block of reader.push(chunk)) welch.push(stage.push(block));
 *   const { tail, summary } = stage.finish();   // welch.push(tail); summary.carrierOffsetHz …
 *
 * Kinds:  'iq'        φ = unwrap(atan2(Q, I)) (METHODS 2.1), then ν = fs/(2π)·Δφ
 *         'phase'     rad in (unwrapped again, harmless for a sampled phase), then ν = fs/(2π)·Δφ
 *         'beat'      complex mix-down by the IF + FIR low-pass (analysis/phase/beat-demodulator.ts), then as 'iq'
 *         'frequency' Hz in, passed through
 * Units: input as the kind says; output Hz at `outputRateHz` (= fs, or fs/decimation for a beat note).
 * The mean (carrier offset) and the linear drift are NOT subtracted here: the Welch stage removes
 * them per segment (detrend 'constant' / 'linear'); they are reported from running sums in the summary.
 * State (last phase, filter history) is carried across blocks: the output does not depend on block sizes.
 */

import type { CaptureKind, FrequencyStageSummary, SampleBlock } from '../types';

export interface FrequencyStageOptions {
  kind: CaptureKind;
  /** input sample rate, Hz */
  sampleRateHz: number;
  /** beat note: the IF, Hz; found from the spectrum peak of the first `ifSearchSamples` when omitted */
  intermediateFrequencyHz?: number;
  /** beat note: flat pass band ±B of the complex low-pass, Hz; default 0.75·min(f_IF, fs/2 − f_IF) */
  bandwidthHz?: number;
  /** beat note: keep every D-th filtered sample (default 1); needs fs/D ≥ 2·min(f_IF, fs/2 − f_IF)… see beat-demodulator */
  decimation?: number;
  /** beat note: samples buffered to find the IF when it is not given (default 65536) */
  ifSearchSamples?: number;
}

export interface FrequencyStage {
  /** rate of the frequency samples, Hz */
  readonly outputRateHz: number;
  /** Next block in; the frequency samples (Hz) it completes (a new array, possibly empty). */
  push(block: SampleBlock): Float64Array;
  /** No more input: the last samples (possibly empty) and the summary. */
  finish(): { tail: Float64Array; summary: FrequencyStageSummary };
}

export declare function createFrequencyStage(options: FrequencyStageOptions): FrequencyStage;
