/**
 * Log-frequency S_ν estimate from about 1/T0 to fs/2: a cascade of decimate-by-2 stages feeding Welch
 * accumulators, stitched onto one log-spaced grid. Streaming; memory O(L + L'·stages); work ≈ one
 * Welch pass of length L plus the decimators (≈ 1.2× a plain Welch estimate).
 *
 * Usage:
 *   import { createLogFrequencyAccumulator } from '../analysis/spectrum/log-frequency';
 *   const acc = createLogFrequencyAccumulator({ sampleRateHz: 10e6, segmentLength: 65536, pointsPerDecade: 30 });
 *   acc.push(frequencyBlock); …
 *   const s = acc.result();   // LogFrequencySpectrum: frequencyHz, psd, averages, resolutionHz, stage, reliableFromHz
 *
 * Level s runs at fs_s = fs/2^s (binomial low-pass + decimation by 2 between levels,
 * analysis/spectrum/decimate-by-two.ts). Level 0 carries a Welch accumulator of segment L; the deeper
 * levels from s1 = the smallest s with 2^s·L' ≥ 2L carry Welch accumulators of segment L' (default
 * min(L, 1024)). A segment of L' at level s spans L'·2^s input samples, the same time as a segment of
 * L at level s − log2(L/L'): the same resolution and averages for about L'/L of the FFT work.
 * Stitching rule (METHODS 1.5, "cheaper engineering alternative"): every frequency comes from the stage
 * with the finest resolution that still has K ≥ minAverages and f ≥ minBin·fs_s/L_s. So level 0 gives
 * [minBin·fs/L, fs/2) with resolution fs/L and the most averages, and each deeper stage gives
 * [minBin·fs_s/L', the next shallower stage's low edge) — bins [minBin, 2·minBin) when L/L' is a power
 * of two — i.e. resolution between f/(2·minBin) and f/minBin, K_s ≈ T0·f/(minBin·(1 − overlap)).
 * The droop of the binomial filters, Π_j cos^{2q}(πf/r_j) over the rates r_j before each decimation,
 * is divided out (≤ 1e-4 at the defaults); aliases reach the bins used below −85 dB (q = 6).
 * Reaching 1/T0: below `reliableFromHz` (the lowest frequency meeting the rule) the deepest stage that
 * completed at least one segment contributes its bins m ≥ 1. Its first bin is fs_S/L' with
 * L' ≤ N_S < 2L' + q + 1 (N_S the samples that reached it), i.e. the lowest point lies in [1/T0, ≈2/T0]
 * (2/T0 exactly when N is a power of two times L'). Those points have few averages (often K = 1) and,
 * for steep spectra, window leakage (METHODS 1.4): read them as indicative.
 * DC and the Nyquist bin are left out (their one-sided values are not densities of the same kind).
 * Output: with pointsPerDecade > 0 the stitched bins are merged into geometric bins (mean of linear
 * values, analysis/spectrum/log-binning.ts); `averages` is then the sum of K over the merged bins and
 * `resolutionHz` the summed bin widths; `stage` is the level of the lowest merged bin.
 * Units: the input's unit (Hz for ν) → unit²/Hz, one-sided, as analysis/spectrum/welch.ts.
 * Defaults: L 4096, L' min(L, 1024), hann, overlap by window, detrend 'constant', minBin 4,
 * minAverages 2, 30 points per decade, binomial order 6.
 * Worked check: white noise of density h0 reads h0 at every point (within its χ² scatter), from the
 * first point near 1/T0 to just below fs/2.
 */

import { AnalysisInputError } from '../errors';
import type { DetrendName, LogFrequencySpectrum, WelchSpectrum, WindowName } from '../types';
import { binomialPowerGain, createDecimatorByTwo, type DecimatorByTwo } from './decimate-by-two';
import { resolveWelchOptions, type ResolvedWelchOptions } from './spectral-helper';
import { createWelchAccumulator, type WelchAccumulator } from './welch';

export interface LogFrequencyOptions {
  sampleRateHz: number;
  /** L of every stage (default 4096; at least 16·minBin) */
  segmentLength?: number;
  /** default 'hann' */
  window?: WindowName;
  /** default by window, as analysis/spectrum/spectral-helper.ts */
  overlap?: number;
  /** default 'constant'; 'linear' also removes a frequency drift */
  detrend?: DetrendName;
  /** a stage serves frequencies from bin minBin up (default 4, METHODS 1.5) */
  minBin?: number;
  /** and only when it has at least this many segments (default 2) */
  minAverages?: number;
  /** geometric output bins per decade (default 30; 0 = every stitched Welch bin) */
  pointsPerDecade?: number;
  /** order q of the binomial anti-alias filter (default 6) */
  decimatorOrder?: number;
  /** segment length L' of the deeper stages (default min(L, 1024); 16·minBin ≤ L' ≤ L) */
  cascadeSegmentLength?: number;
}

export interface ResolvedLogFrequencyOptions {
  welch: ResolvedWelchOptions;
  minBin: number;
  minAverages: number;
  pointsPerDecade: number;
  decimatorOrder: number;
  cascadeSegmentLength: number;
}

export interface LogFrequencyAccumulator {
  readonly options: ResolvedLogFrequencyOptions;
  readonly samplesSeen: number;
  /** stages created so far (stage s runs at fs/2^s) */
  readonly stageCount: number;
  push(x: ArrayLike<number>): void;
  result(): LogFrequencySpectrum;
}

/** Deepest stage: 2^40 decimation is beyond any record. */
export const MAX_STAGES = 41;

export function resolveLogFrequencyOptions(options: LogFrequencyOptions): ResolvedLogFrequencyOptions {
  if (options === null || typeof options !== 'object') {
    throw new AnalysisInputError('log-frequency options must be an object with at least sampleRateHz');
  }
  const welch = resolveWelchOptions({
    sampleRateHz: options.sampleRateHz,
    segmentLength: options.segmentLength,
    window: options.window,
    overlap: options.overlap,
    detrend: options.detrend,
    scaling: 'density',
  });
  const minBin = options.minBin ?? 4;
  if (!Number.isInteger(minBin) || minBin < 1) {
    throw new AnalysisInputError(`minBin must be an integer >= 1, got ${String(minBin)}`);
  }
  if (welch.segmentLength < 16 * minBin) {
    throw new AnalysisInputError(
      `segmentLength must be at least 16·minBin = ${16 * minBin} so each stage is read well below its Nyquist, got ${welch.segmentLength}`,
    );
  }
  const minAverages = options.minAverages ?? 2;
  if (!Number.isInteger(minAverages) || minAverages < 1) {
    throw new AnalysisInputError(`minAverages must be an integer >= 1, got ${String(minAverages)}`);
  }
  const pointsPerDecade = options.pointsPerDecade ?? 30;
  if (!(typeof pointsPerDecade === 'number' && Number.isFinite(pointsPerDecade) && pointsPerDecade >= 0)) {
    throw new AnalysisInputError(`pointsPerDecade must be a number >= 0, got ${String(pointsPerDecade)}`);
  }
  const decimatorOrder = options.decimatorOrder ?? 6;
  if (!Number.isInteger(decimatorOrder) || decimatorOrder < 2 || decimatorOrder > 16) {
    throw new AnalysisInputError(`decimatorOrder must be an integer in [2, 16], got ${String(decimatorOrder)}`);
  }
  const cascadeSegmentLength = options.cascadeSegmentLength ?? Math.max(16 * minBin, Math.min(welch.segmentLength, 1024));
  if (
    !Number.isInteger(cascadeSegmentLength) ||
    cascadeSegmentLength < 16 * minBin ||
    cascadeSegmentLength > welch.segmentLength
  ) {
    throw new AnalysisInputError(
      `cascadeSegmentLength must be an integer in [16·minBin, segmentLength] = [${16 * minBin}, ${welch.segmentLength}], got ${String(options.cascadeSegmentLength)}`,
    );
  }
  return { welch, minBin, minAverages, pointsPerDecade, decimatorOrder, cascadeSegmentLength };
}

interface Stage {
  /** decimation level s: rate fs/2^s */
  level: number;
  rateHz: number;
  /** null on the levels that only decimate */
  welch: WelchAccumulator | null;
  segmentLength: number;
  decimator: DecimatorByTwo;
}

/** First level carrying a cascade Welch accumulator: the smallest s with 2·minBin·fs/(2^s·L') ≤ minBin·fs/L. */
export function firstCascadeLevel(segmentLength: number, cascadeSegmentLength: number): number {
  let s = 1;
  while (2 ** s * cascadeSegmentLength < 2 * segmentLength) s++;
  return s;
}

export function createLogFrequencyAccumulator(options: LogFrequencyOptions): LogFrequencyAccumulator {
  const o = resolveLogFrequencyOptions(options);
  const fs = o.welch.sampleRateHz;
  const L = o.welch.segmentLength;
  const Lc = o.cascadeSegmentLength;
  const s1 = firstCascadeLevel(L, Lc);
  const stages: Stage[] = [];
  let samplesSeen = 0;

  function makeStage(s: number): Stage {
    const rateHz = fs / 2 ** s;
    const segmentLength = s === 0 ? L : Lc;
    const hasWelch = s === 0 || s >= s1;
    return {
      level: s,
      rateHz,
      segmentLength,
      welch: hasWelch
        ? createWelchAccumulator({
            sampleRateHz: rateHz,
            segmentLength,
            window: o.welch.window,
            overlap: o.welch.overlap,
            detrend: o.welch.detrend,
            scaling: 'density',
          })
        : null,
      decimator: createDecimatorByTwo(o.decimatorOrder),
    };
  }

  function feed(s: number, x: ArrayLike<number>): void {
    if (x.length === 0) return;
    if (s >= stages.length) stages.push(makeStage(s));
    const stage = stages[s];
    if (stage.welch) stage.welch.push(x);
    if (s + 1 < MAX_STAGES) feed(s + 1, stage.decimator.push(x));
  }

  return {
    options: o,
    get samplesSeen() {
      return samplesSeen;
    },
    get stageCount() {
      return stages.length;
    },
    push(x) {
      samplesSeen += x.length;
      feed(0, x);
    },
    result(): LogFrequencySpectrum {
      // the Welch-bearing stages, shallow to deep, with their estimates (null: no segment yet)
      const W = stages.filter((st) => st.welch !== null);
      const results: (WelchSpectrum | null)[] = W.map((st) => (st.welch!.segments > 0 ? st.welch!.result() : null));
      if (results.length === 0 || results[0] === null) {
        throw new AnalysisInputError(
          `the series has ${samplesSeen} samples, fewer than one segment of ${L}: choose a shorter segment`,
        );
      }
      // deepest stage meeting K ≥ minAverages (reliable), and deepest with any segment
      let reliable = -1;
      let deepest = 0;
      for (let i = 0; i < results.length; i++) {
        const r = results[i];
        if (r === null) break;
        deepest = i;
        if (r.averages >= o.minAverages && reliable === i - 1) reliable = i;
      }
      const q = o.decimatorOrder;
      const fList: number[] = [];
      const pList: number[] = [];
      const kList: number[] = [];
      const resList: number[] = [];
      const sList: number[] = [];
      const add = (i: number, m: number): void => {
        const r = results[i]!;
        const level = W[i].level;
        const f = r.frequencyHz[m];
        // divide out the droop of the binomial filters passed: Π_j cos^{2q}(π f / r_j), r_j = fs/2^j, j < level
        let gain = 1;
        for (let j = 0; j < level; j++) gain *= binomialPowerGain(f, fs / 2 ** j, q);
        fList.push(f);
        pList.push(r.psd[m] / gain);
        kList.push(r.averages);
        resList.push(W[i].rateHz / W[i].segmentLength);
        sList.push(level);
      };
      const lowEdge = (i: number): number => (o.minBin * W[i].rateHz) / W[i].segmentLength;
      const reliableFromHz = reliable >= 0 ? lowEdge(reliable) : fs / 2;
      // below the rule: the deepest stage's bins m ≥ 1 under reliableFromHz
      {
        const r = results[deepest]!;
        for (let m = 1; m < r.psd.length && r.frequencyHz[m] < reliableFromHz; m++) add(deepest, m);
      }
      // reliable stages, deepest first: each covers [its low edge, the next shallower stage's low edge);
      // stage 0 up to fs/2 but without the Nyquist bin (not doubled: half the density of white noise, half the dof)
      for (let i = reliable; i >= 0; i--) {
        const r = results[i]!;
        const top = i === 0 ? (L % 2 === 0 ? fs / 2 : Infinity) : lowEdge(i - 1);
        for (let m = o.minBin; m < r.psd.length && r.frequencyHz[m] < top; m++) add(i, m);
      }
      const base = {
        reliableFromHz,
        sampleRateHz: fs,
        segmentLength: L,
        window: o.welch.window,
        samplesSeen,
      };
      if (o.pointsPerDecade === 0) {
        return {
          ...base,
          frequencyHz: Float64Array.from(fList),
          psd: Float64Array.from(pList),
          averages: Float64Array.from(kList),
          resolutionHz: Float64Array.from(resList),
          stage: Uint8Array.from(sList),
        };
      }
      // geometric bins from the lowest point, mean of linear values (as analysis/spectrum/log-binning.ts)
      const lo = fList[0];
      const ppd = o.pointsPerDecade;
      const F: number[] = [];
      const P: number[] = [];
      const K: number[] = [];
      const R: number[] = [];
      const S: number[] = [];
      const counts: number[] = [];
      let current = -1;
      for (let i = 0; i < fList.length; i++) {
        const bin = Math.floor(ppd * Math.log10(fList[i] / lo) + 1e-9);
        if (bin !== current) {
          F.push(0);
          P.push(0);
          K.push(0);
          R.push(0);
          S.push(sList[i]);
          counts.push(0);
          current = bin;
        }
        const j = F.length - 1;
        F[j] += fList[i];
        P[j] += pList[i];
        K[j] += kList[i];
        R[j] += resList[i];
        counts[j]++;
      }
      for (let j = 0; j < F.length; j++) {
        F[j] /= counts[j];
        P[j] /= counts[j]; // mean of linear values
      }
      return {
        ...base,
        frequencyHz: Float64Array.from(F),
        psd: Float64Array.from(P),
        averages: Float64Array.from(K),
        resolutionHz: Float64Array.from(R),
        stage: Uint8Array.from(S),
      };
    },
  };
}
