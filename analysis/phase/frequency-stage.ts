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
 * First difference, no correction (METHODS 2.4): for sampled white FM the differenced phase is exactly
 * white with level h0 up to Nyquist; the 1/sinc²(f/fs) correction, for band-limited S_ν only, is
 * analysis/spectrum/finite-difference-correction.ts, applied to the spectrum.
 * Warnings (summary.warnings): steps > 0.8π (METHODS 2.7), samples with |z|² < 1e-6 × running mean |z|².
 * A beat note without intermediateFrequencyHz is buffered for `ifSearchSamples` before anything comes
 * out; bandwidthHz/decimation are then checked against the IF found (AnalysisInputError from push).
 * References: IEEE Std 1139-2008 (ν = (1/2π)·dφ/dt); numpy.unwrap semantics for the wrap of Δφ.
 * Worked check: I + iQ = e^{2πi·1234.5·k/fs} gives ν = 1234.5 Hz in every sample, drift 0.
 */

import { AnalysisInputError } from '../errors';
import type { CaptureKind, FrequencyStageSummary, SampleBlock } from '../types';
import { createBeatDemodulator, resolveBeatOptions, type BeatDemodulator } from './beat-demodulator';
import { createCarrierStatistics } from './carrier-statistics';
import { estimateIntermediateFrequency } from './intermediate-frequency';
import { LARGE_STEP_RAD } from './unwrap';

export interface FrequencyStageOptions {
  kind: CaptureKind;
  /** input sample rate, Hz */
  sampleRateHz: number;
  /** beat note: the IF, Hz; found from the spectrum peak of the first `ifSearchSamples` when omitted */
  intermediateFrequencyHz?: number;
  /** beat note: flat pass band ±B of the complex low-pass, Hz; default 0.75·min(f_IF, fs/2 − f_IF) */
  bandwidthHz?: number;
  /** beat note: keep every D-th filtered sample (default 1); needs fs/D ≥ B + min(f_IF, fs/2 − f_IF) */
  decimation?: number;
  /** beat note: samples buffered to find the IF when it is not given (default 65536, at least 64) */
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

const KINDS: readonly CaptureKind[] = ['phase', 'iq', 'beat', 'frequency'];
/** |z|² below this fraction of the running mean |z|² counts as "amplitude ≈ 0" (−60 dB). */
export const LOW_AMPLITUDE_POWER_FRACTION = 1e-6;
const TWO_PI = 2 * Math.PI;
const EMPTY: Float64Array = new Float64Array(0);

interface ResolvedStageOptions {
  kind: CaptureKind;
  sampleRateHz: number;
  intermediateFrequencyHz: number | undefined;
  bandwidthHz: number | undefined;
  decimation: number;
  ifSearchSamples: number;
}

function resolveStageOptions(options: FrequencyStageOptions): ResolvedStageOptions {
  if (options === null || typeof options !== 'object') {
    throw new AnalysisInputError('frequency stage options must be an object with kind and sampleRateHz');
  }
  if (!KINDS.includes(options.kind)) {
    throw new AnalysisInputError(`kind must be one of ${KINDS.join(', ')}, got ${String(options.kind)}`);
  }
  const fs = options.sampleRateHz;
  if (!(typeof fs === 'number' && Number.isFinite(fs) && fs > 0)) {
    throw new AnalysisInputError(`sampleRateHz must be a positive finite number, got ${String(fs)}`);
  }
  const search = options.ifSearchSamples ?? 65536;
  if (!Number.isInteger(search) || search < 64 || search > 2 ** 24) {
    throw new AnalysisInputError(`ifSearchSamples must be an integer in [64, 2^24], got ${String(search)}`);
  }
  const decimation = options.decimation ?? 1;
  if (options.kind !== 'beat') {
    for (const key of ['intermediateFrequencyHz', 'bandwidthHz', 'decimation'] as const) {
      if (options[key] !== undefined) {
        throw new AnalysisInputError(`${key} applies to beat-note captures only (kind is '${options.kind}')`);
      }
    }
  }
  if (options.kind === 'beat') {
    // validate what is known now; the IF itself may come later from the spectrum
    resolveBeatOptions({
      sampleRateHz: fs,
      intermediateFrequencyHz: options.intermediateFrequencyHz ?? fs / 4,
      bandwidthHz: options.intermediateFrequencyHz === undefined ? undefined : options.bandwidthHz,
      decimation: options.intermediateFrequencyHz === undefined ? 1 : decimation,
    });
    if (!Number.isInteger(decimation) || decimation < 1) {
      throw new AnalysisInputError(`decimation must be an integer >= 1, got ${String(decimation)}`);
    }
  }
  return {
    kind: options.kind,
    sampleRateHz: fs,
    intermediateFrequencyHz: options.intermediateFrequencyHz,
    bandwidthHz: options.bandwidthHz,
    decimation,
    ifSearchSamples: search,
  };
}

export function createFrequencyStage(options: FrequencyStageOptions): FrequencyStage {
  const o = resolveStageOptions(options);
  const kind = o.kind;
  const outputRateHz = o.sampleRateHz / (kind === 'beat' ? o.decimation : 1);
  const toHz = outputRateHz / TWO_PI; // ν = fs/(2π)·Δφ
  const stats = createCarrierStatistics(outputRateHz);
  const warnings: string[] = [];

  let inputSamples = 0;
  let frequencySamples = 0;
  let largeSteps = 0;
  let lowAmplitude = 0;
  let started = false;
  let prevPhase = 0; // last raw phase (rad): atan2 for iq/beat, the input for 'phase'
  let powerSum = 0; // running Σ|z|² and count for the low-amplitude test
  let powerCount = 0;

  // beat note
  let demod: BeatDemodulator | null = null;
  let ifSource: 'given' | 'spectrum-peak' | undefined;
  let search: Float64Array | null = null;
  let searchFill = 0;

  function checkBlock(block: SampleBlock): void {
    const want = kind === 'iq' ? 2 : 1;
    if (!block || !Array.isArray(block.channels) || block.channels.length !== want) {
      throw new AnalysisInputError(
        `a '${kind}' capture needs ${want} channel${want === 1 ? '' : 's'} per block, got ${block?.channels?.length ?? 'none'}`,
      );
    }
    if (want === 2 && block.channels[0].length !== block.channels[1].length) {
      throw new AnalysisInputError(`I and Q blocks differ in length (${block.channels[0].length} vs ${block.channels[1].length})`);
    }
  }

  /** ν from a complex series: Δ of atan2, wrapped into [−π, π] (== diff of the unwrapped phase). */
  function fromComplex(re: ArrayLike<number>, im: ArrayLike<number>): Float64Array {
    const n = re.length;
    if (n === 0) return EMPTY;
    const out = new Float64Array(started ? n : n - 1);
    let j = 0;
    let prev = prevPhase;
    let ps = powerSum;
    let pc = powerCount;
    let low = 0;
    let large = 0;
    for (let k = 0; k < n; k++) {
      const x = re[k];
      const y = im[k];
      const p2 = x * x + y * y;
      ps += p2;
      pc++;
      // |z|² below 1e-6 × running mean |z|²: the phase of this sample is random
      if (p2 * pc <= LOW_AMPLITUDE_POWER_FRACTION * ps) low++;
      const a = Math.atan2(y, x);
      if (!started) {
        started = true;
        prev = a;
        continue;
      }
      let d = a - prev;
      if (d > Math.PI) d -= TWO_PI;
      else if (d < -Math.PI) d += TWO_PI;
      if (d > LARGE_STEP_RAD || d < -LARGE_STEP_RAD) large++;
      prev = a;
      out[j++] = d * toHz;
    }
    prevPhase = prev;
    powerSum = ps;
    powerCount = pc;
    lowAmplitude += low;
    largeSteps += large;
    return out;
  }

  /** ν from a phase series (rad): Δφ wrapped into [−π, π] as numpy.unwrap would. */
  function fromPhase(p: ArrayLike<number>): Float64Array {
    const n = p.length;
    if (n === 0) return EMPTY;
    const out = new Float64Array(started ? n : n - 1);
    let j = 0;
    let k = 0;
    let prev = prevPhase;
    let large = 0;
    if (!started) {
      prev = p[0];
      started = true;
      k = 1;
    }
    for (; k < n; k++) {
      const a = p[k];
      let d = a - prev;
      if (d > Math.PI || d < -Math.PI) {
        // unwrap: remove whole turns
        d -= TWO_PI * Math.round(d / TWO_PI);
      }
      if (d > LARGE_STEP_RAD || d < -LARGE_STEP_RAD) large++;
      prev = a;
      out[j++] = d * toHz;
    }
    prevPhase = prev;
    largeSteps += large;
    return out;
  }

  function startDemodulator(ifHz: number, source: 'given' | 'spectrum-peak'): void {
    const r = resolveBeatOptions({
      sampleRateHz: o.sampleRateHz,
      intermediateFrequencyHz: ifHz,
      bandwidthHz: o.bandwidthHz,
      decimation: o.decimation,
    });
    demod = createBeatDemodulator(r);
    ifSource = source;
  }

  function emit(nu: Float64Array): Float64Array {
    stats.add(nu);
    frequencySamples += nu.length;
    return nu;
  }

  function concat(a: Float64Array, b: Float64Array): Float64Array {
    if (a.length === 0) return b;
    if (b.length === 0) return a;
    const c = new Float64Array(a.length + b.length);
    c.set(a);
    c.set(b, a.length);
    return c;
  }

  if (kind === 'beat' && o.intermediateFrequencyHz !== undefined) startDemodulator(o.intermediateFrequencyHz, 'given');
  if (kind === 'beat' && demod === null) search = new Float64Array(o.ifSearchSamples);

  function pushBeat(v: ArrayLike<number>): Float64Array {
    if (demod === null && search !== null) {
      const take = Math.min(v.length, search.length - searchFill);
      for (let k = 0; k < take; k++) search[searchFill + k] = v[k];
      searchFill += take;
      if (searchFill < search.length) return EMPTY;
      startDemodulator(estimateIntermediateFrequency(search, o.sampleRateHz), 'spectrum-peak');
      const buffered = search;
      search = null;
      const first = pushBeat(buffered);
      const rest = take < v.length ? pushBeat(subarray(v, take)) : EMPTY;
      return concat(first, rest);
    }
    const z = demod!.push(v);
    return fromComplex(z.re, z.im);
  }

  function subarray(v: ArrayLike<number>, from: number): ArrayLike<number> {
    const t = v as Float64Array;
    return typeof t.subarray === 'function' ? t.subarray(from) : Array.prototype.slice.call(v, from);
  }

  function summary(): FrequencyStageSummary {
    const mean = stats.meanHz;
    const s: FrequencyStageSummary = {
      kind,
      inputSamples,
      frequencySamples,
      outputRateHz,
      carrierOffsetHz: kind === 'beat' && demod ? demod.options.intermediateFrequencyHz + mean : mean,
      driftHzPerS: stats.slopeHzPerS,
      lowAmplitudeSamples: lowAmplitude,
      largeStepSamples: largeSteps,
      warnings,
    };
    if (kind === 'beat' && demod) {
      s.intermediateFrequencyHz = demod.options.intermediateFrequencyHz;
      s.intermediateFrequencySource = ifSource;
      s.bandwidthHz = demod.options.bandwidthHz;
    }
    return s;
  }

  let finished = false;
  return {
    outputRateHz,
    push(block) {
      if (finished) throw new AnalysisInputError('the frequency stage has finished; start a new one');
      checkBlock(block);
      const ch = block.channels;
      inputSamples += ch[0].length;
      switch (kind) {
        case 'iq':
          return emit(fromComplex(ch[0], ch[1]));
        case 'phase':
          return emit(fromPhase(ch[0]));
        case 'frequency':
          if (!started && ch[0].length > 0) started = true;
          return emit(Float64Array.from(ch[0]));
        case 'beat':
          return emit(pushBeat(ch[0]));
      }
    },
    finish() {
      if (finished) throw new AnalysisInputError('finish() was already called');
      finished = true;
      let tail: Float64Array = EMPTY;
      if (kind === 'beat') {
        if (demod === null && search !== null) {
          if (searchFill < 64) {
            throw new AnalysisInputError(`the beat-note record has ${searchFill} samples; at least 64 are needed`);
          }
          startDemodulator(estimateIntermediateFrequency(search.subarray(0, searchFill), o.sampleRateHz), 'spectrum-peak');
          const buffered = search.subarray(0, searchFill);
          search = null;
          tail = pushBeat(buffered);
        }
        const z = demod!.finish();
        tail = emit(concat(tail, fromComplex(z.re, z.im)));
      }
      if (largeSteps > 0) {
        warnings.push(
          `${largeSteps} phase steps exceeded 0.8π: the sample rate may be too low for the linewidth and carrier offset, so unwrapping may have failed there (recommend fs ≥ 50 × (linewidth + peak excursion))`,
        );
      }
      if (lowAmplitude > 0) {
        warnings.push(`${lowAmplitude} samples had an amplitude below 1/1000 of the RMS amplitude: their phase is random`);
      }
      if (frequencySamples === 0) {
        warnings.push('no frequency samples were produced: the record is too short');
      }
      return { tail, summary: summary() };
    },
  };
}
