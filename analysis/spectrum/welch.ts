/**
 * Welch's averaged-periodogram PSD, as a streaming accumulator over a real series.
 *
 * Usage:
 *   import { createWelchAccumulator, welch } from '../analysis/spectrum/welch';
 *   const acc = createWelchAccumulator({ sampleRateHz: 10e6, segmentLength: 65536 });
 *   acc.push(block1); acc.push(block2);          // any block sizes; the result does not depend on them
 *   const s = acc.result();                      // WelchSpectrum: frequencyHz, psd (unit²/Hz), K, K_eff, ENBW
 *   welch(x, { sampleRateHz: 1e3, segmentLength: 1024 });   // the same over one array
 *
 * Steps per segment s_k[n] = x[kD + n], n < L (METHODS 1.1):
 *   detrend (segment mean, or least-squares line) → multiply by the periodic window w
 *   → |X_k[m]|², m = 0..⌊L/2⌋ → running sum over k.
 * Result: P[m] = (1/K)·Σ_k |X_k[m]|² × scale, scale = 1/(fs·Σw²) for 'density' (unit²/Hz) or
 *   1/(Σw)² for 'spectrum' (unit²); one-sided: every bin doubled except DC and (L even) Nyquist.
 *   f_m = m·fs/L; ENBW = fs·Σw²/(Σw)²; K_eff as in analysis/spectrum/equivalent-averages.ts.
 *   Samples after the last complete segment are not used (as scipy.signal.welch).
 * Memory: O(L), allocated once; no allocation per segment; fft.js (power-of-two L) or Bluestein.
 * Reference: P. D. Welch, IEEE Trans. Audio Electroacoust. AU-15(2), 70-73 (1967); normalisations
 *   as in G. Heinzel, A. Rüdiger, R. Schilling, AEI Hannover report (2002).
 * Worked check: white noise σ = 1 at fs = 1 kHz → density 2σ²/fs = 2.000e-3 /Hz in every bin but DC
 *   and Nyquist; tests compare with scipy.signal.welch to 1e-9 (tests/fixtures/welch/).
 */

import { AnalysisInputError } from '../errors';
import type { WelchSpectrum } from '../types';
import { equivalentAverages } from './equivalent-averages';
import { createPowerSpectrumPlan } from './power-spectrum-plan';
import { resolveWelchOptions, type ResolvedWelchOptions, type WelchOptions } from './spectral-helper';
import { makeWindow, windowSums } from './windows';

export type { WelchOptions } from './spectral-helper';

export interface WelchAccumulator {
  readonly options: ResolvedWelchOptions;
  /** segments completed so far, K */
  readonly segments: number;
  /** samples pushed so far */
  readonly samplesSeen: number;
  /** Feed the next samples (not modified, not kept). */
  push(x: ArrayLike<number>): void;
  /** The estimate over the segments completed so far; throws AnalysisInputError when K = 0. */
  result(): WelchSpectrum;
  /** Raw running sum Σ_k |X_k[m]|² (a view, do not modify) — for stitching estimators. */
  readonly rawSum: Float64Array;
}

export function createWelchAccumulator(options: WelchOptions): WelchAccumulator {
  const o = resolveWelchOptions(options);
  const L = o.segmentLength;
  const hop = o.hop;
  const linear = o.detrend === 'linear';
  const w = makeWindow(o.window, L);
  const { s1, s2 } = windowSums(w);
  const plan = createPowerSpectrumPlan(L);
  const bins = plan.bins;
  const buffer = new Float64Array(L);
  const segment = new Float64Array(L);
  const sum = new Float64Array(bins);
  // centred time t_n = n − (L−1)/2 for the least-squares line; Σt² = L(L²−1)/12
  const tMid = (L - 1) / 2;
  const sumT2 = (L * (L * L - 1)) / 12;
  let fill = 0;
  let segments = 0;
  let samplesSeen = 0;

  function processSegment(): void {
    let mean = 0;
    for (let n = 0; n < L; n++) mean += buffer[n];
    mean /= L;
    if (linear) {
      let st = 0;
      for (let n = 0; n < L; n++) st += (n - tMid) * buffer[n];
      const slope = st / sumT2;
      // remove the least-squares line mean + slope·t_n, then window
      for (let n = 0; n < L; n++) segment[n] = (buffer[n] - mean - slope * (n - tMid)) * w[n];
    } else {
      // remove the segment mean, then window
      for (let n = 0; n < L; n++) segment[n] = (buffer[n] - mean) * w[n];
    }
    plan.accumulate(segment, sum);
    segments++;
  }

  return {
    options: o,
    get segments() {
      return segments;
    },
    get samplesSeen() {
      return samplesSeen;
    },
    rawSum: sum,
    push(x: ArrayLike<number>) {
      const n = x.length;
      const typed = ArrayBuffer.isView(x) ? (x as Float64Array) : null;
      let i = 0;
      while (i < n) {
        const take = Math.min(L - fill, n - i);
        if (typed) buffer.set(typed.subarray(i, i + take), fill); // block copy
        else for (let j = 0; j < take; j++) buffer[fill + j] = x[i + j];
        fill += take;
        i += take;
        if (fill === L) {
          processSegment();
          // keep the overlap L − D for the next segment
          buffer.copyWithin(0, hop, L);
          fill = L - hop;
        }
      }
      samplesSeen += n;
    },
    result(): WelchSpectrum {
      if (segments === 0) {
        throw new AnalysisInputError(
          `the series has ${samplesSeen} samples, fewer than one segment of ${L}: choose a shorter segment`,
        );
      }
      const fs = o.sampleRateHz;
      // density scaling 1/(fs·Σw²); spectrum scaling 1/(Σw)²
      const scale = (o.scaling === 'density' ? 1 / (fs * s2) : 1 / (s1 * s1)) / segments;
      const psd = new Float64Array(bins);
      const frequencyHz = new Float64Array(bins);
      const nyquistBin = L % 2 === 0 ? bins - 1 : -1;
      for (let m = 0; m < bins; m++) {
        // one-sided: double all bins except DC and Nyquist
        const fold = m === 0 || m === nyquistBin ? 1 : 2;
        psd[m] = sum[m] * scale * fold;
        frequencyHz[m] = (m * fs) / L;
      }
      return {
        frequencyHz,
        psd,
        sampleRateHz: fs,
        window: o.window,
        segmentLength: L,
        hop,
        detrend: o.detrend,
        scaling: o.scaling,
        averages: segments,
        equivalentAverages: equivalentAverages(w, hop, segments),
        enbwHz: (fs * s2) / (s1 * s1), // ENBW = fs·Σw²/(Σw)²
        samplesSeen,
        samplesUsed: (segments - 1) * hop + L,
      };
    },
  };
}

/** Welch over one array: the same as one push into a fresh accumulator. */
export function welch(x: ArrayLike<number>, options: WelchOptions): WelchSpectrum {
  const acc = createWelchAccumulator(options);
  acc.push(x);
  return acc.result();
}
