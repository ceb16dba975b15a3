/**
 * Synthetic captures with a known frequency-noise model, generated block by block (bounded memory).
 *
 * Usage:
 *   import { createSynthGenerator, synthesize } from '../analysis/synth/generator';
 *   const gen = createSynthGenerator({ sampleRateHz: 10e6, output: 'iq', whiteHz2PerHz: 1e4, flickerHz2: 1e8, seed: 3 });
 *   const block = gen.next(65536);                // SampleBlock: channels [I, Q]
 *   synthesize({ sampleRateHz: 1e6, output: 'frequency', whiteHz2PerHz: 100 }, 1 << 20);   // one block
 *
 * Frequency ν[k] (Hz), the sum of (analysis/synth/synth-options.ts for the options):
 *   white FM h0       i.i.d. N(0, h0·fs/2): one-sided density 2σ²/fs = h0 up to fs/2 (exact)
 *   flicker FM h₋₁    bank of relaxation processes (analysis/synth/flicker-bank.ts): h₋₁/f within
 *                     −1 %…+0.3 % from flickerLowestHz to fs/10
 *   random-walk FM h₋₂ ν_rw[k] = ν_rw[k−1] + N(0, 2π²h₋₂/fs): one-sided PSD h₋₂·π²/(fs²·sin²(πf/fs)),
 *                     which is h₋₂/f² sampled (aliased) — within 3.4 % of h₋₂/f² below fs/10
 *   bumps             resonant AR(2) processes (analysis/synth/resonance.ts)
 *   spurs             Δf·sin(2π f_m t + θ) (a line of power Δf²/2)
 *   carrier offset + drift·t
 * Phase φ[k] = φ[k−1] + 2π·ν[k]/fs, so fs/(2π)·(φ[k] − φ[k−1]) gives ν[k] back exactly (the first
 * difference is the exact inverse; METHODS 2.4). Outputs:
 *   'frequency'  ν + n (Hz)           'phase'  φ + n (rad)
 *   'iq'         A·cos φ + n₁, A·sin φ + n₂        'beat'  A·cos(2π f_IF t + φ) + n
 * n is white with the one-sided density N0 = additiveNoiseDensity (variance N0·fs/2 per channel).
 * Additive noise reads as a phase floor S_φ = N0/A² for 'iq' and N0/(A²/2) for 'beat' (METHODS 2.6).
 * Random numbers: xoshiro128** + Marsaglia polar (analysis/synth/prng.ts, gaussian.ts); the same seed
 * and options give the same samples whatever the block sizes.
 * Worked check: 'frequency' output with h0 = 3 Hz²/Hz at fs = 1 kHz has per-sample variance h0·fs/2 = 1500 Hz².
 */

import { AnalysisInputError } from '../errors';
import type { SampleBlock } from '../types';
import { createFlickerBank, type FlickerBank } from './flicker-bank';
import { createGaussian } from './gaussian';
import { createRandom } from './prng';
import { createResonance, type Resonance } from './resonance';
import { resolveSynthOptions, type ResolvedSynthOptions, type SynthOptions } from './synth-options';

export interface SynthGenerator {
  readonly options: ResolvedSynthOptions;
  readonly channelCount: 1 | 2;
  readonly samplesOut: number;
  /** The next `count` samples (new arrays). */
  next(count: number): SampleBlock;
}

/** Largest block `next` accepts. */
export const MAX_SYNTH_BLOCK = 2 ** 24;

const TWO_PI = 2 * Math.PI;

export function createSynthGenerator(options: SynthOptions): SynthGenerator {
  const o = resolveSynthOptions(options);
  const fs = o.sampleRateHz;
  // separate streams per component, so adding a component leaves the others' samples unchanged
  const stream = (k: number) => createGaussian(createRandom(o.seed * 256 + k));
  const white = stream(1);
  const walk = stream(2);
  const additive = stream(3);
  const additiveQ = stream(13);
  const flicker: FlickerBank | null =
    o.flickerHz2 > 0
      ? createFlickerBank({ sampleRateHz: fs, level: o.flickerHz2, lowestHz: o.flickerLowestHz }, (i) => stream(64 + i))
      : null;
  const bumps: Resonance[] = o.bumps.map((b, i) =>
    createResonance({ sampleRateHz: fs, centerHz: b.centerHz, widthHz: b.widthHz, peakHz2PerHz: b.peakHz2PerHz }, stream(5 + i)),
  );
  const whiteSigma = Math.sqrt((o.whiteHz2PerHz * fs) / 2); // 2σ²/fs = h0
  const walkSigma = Math.sqrt((2 * Math.PI * Math.PI * o.randomWalkHz3) / fs); // h₋₂ = σ²fs/(2π²)
  const noiseSigma = Math.sqrt((o.additiveNoiseDensity * fs) / 2); // 2σ²/fs = N0
  const spurCycles = o.spurs.map((s) => s.phaseRad / TWO_PI);
  const spurStep = o.spurs.map((s) => s.frequencyHz / fs);
  const ifStep = o.intermediateFrequencyHz / fs;
  let ifCycles = 0;
  let walkState = 0;
  let phase = o.initialPhaseRad;
  let samplesOut = 0;
  const channelCount: 1 | 2 = o.output === 'iq' ? 2 : 1;
  let scratch = new Float64Array(0);

  function frequency(count: number): Float64Array {
    const nu = new Float64Array(count);
    if (scratch.length < count) scratch = new Float64Array(count);
    const e = scratch.subarray(0, count);
    if (whiteSigma > 0) {
      white.fill(e, whiteSigma);
      for (let k = 0; k < count; k++) nu[k] += e[k];
    }
    if (walkSigma > 0) {
      walk.fill(e, walkSigma);
      let w = walkState;
      for (let k = 0; k < count; k++) {
        w += e[k];
        nu[k] += w;
      }
      walkState = w;
    }
    if (flicker) flicker.add(nu);
    for (const b of bumps) b.add(nu);
    for (let s = 0; s < o.spurs.length; s++) {
      const dev = o.spurs[s].peakDeviationHz;
      const step = spurStep[s];
      let c = spurCycles[s];
      for (let k = 0; k < count; k++) {
        nu[k] += dev * Math.sin(TWO_PI * c);
        c += step;
        if (c >= 1) c -= 1;
      }
      spurCycles[s] = c;
    }
    if (o.carrierOffsetHz !== 0 || o.driftHzPerS !== 0) {
      for (let k = 0; k < count; k++) nu[k] += o.carrierOffsetHz + o.driftHzPerS * ((samplesOut + k) / fs);
    }
    return nu;
  }

  function addNoise(x: Float64Array, source = additive): void {
    if (noiseSigma === 0) return;
    const e = scratch.subarray(0, x.length);
    source.fill(e, noiseSigma);
    for (let k = 0; k < x.length; k++) x[k] += e[k];
  }

  return {
    options: o,
    channelCount,
    get samplesOut() {
      return samplesOut;
    },
    next(count) {
      if (!Number.isInteger(count) || count < 0 || count > MAX_SYNTH_BLOCK) {
        throw new AnalysisInputError(`block size must be an integer in [0, ${MAX_SYNTH_BLOCK}], got ${count}`);
      }
      const nu = frequency(count);
      let channels: Float64Array[];
      const toPhase = TWO_PI / fs;
      if (o.output === 'frequency') {
        channels = [nu];
      } else if (o.output === 'phase') {
        for (let k = 0; k < count; k++) {
          phase += toPhase * nu[k]; // φ[k] = φ[k−1] + 2π·ν[k]/fs
          nu[k] = phase;
        }
        channels = [nu];
      } else if (o.output === 'iq') {
        const I = new Float64Array(count);
        const Q = new Float64Array(count);
        const A = o.amplitude;
        for (let k = 0; k < count; k++) {
          phase += toPhase * nu[k];
          if (phase > Math.PI || phase < -Math.PI) phase -= TWO_PI * Math.round(phase / TWO_PI); // keep φ small: only cos/sin used
          I[k] = A * Math.cos(phase);
          Q[k] = A * Math.sin(phase);
        }
        addNoise(I);
        addNoise(Q, additiveQ);
        channels = [I, Q];
      } else {
        const A = o.amplitude;
        for (let k = 0; k < count; k++) {
          phase += toPhase * nu[k];
          if (phase > Math.PI || phase < -Math.PI) phase -= TWO_PI * Math.round(phase / TWO_PI);
          nu[k] = A * Math.cos(TWO_PI * ifCycles + phase); // A·cos(2π f_IF t + φ)
          ifCycles += ifStep;
          if (ifCycles >= 1) ifCycles -= 1;
        }
        channels = [nu];
      }
      if (o.output === 'frequency' || o.output === 'phase' || o.output === 'beat') addNoise(channels[0]);
      samplesOut += count;
      return { channels };
    },
  };
}

/** One block of `count` samples from a fresh generator. */
export function synthesize(options: SynthOptions, count: number): SampleBlock {
  return createSynthGenerator(options).next(count);
}
