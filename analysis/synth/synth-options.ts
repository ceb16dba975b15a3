/**
 * Options of the synthetic-capture generator, resolved once into a complete type.
 *
 * Usage:
 *   import { resolveSynthOptions } from '../analysis/synth/synth-options';
 *   const o = resolveSynthOptions({ sampleRateHz: 10e6, output: 'iq', whiteHz2PerHz: 1e4 });
 *
 * Noise model of the laser frequency (one-sided, METHODS 0 and 5.1): S_ν = h0 + h₋₁/f + h₋₂/f²,
 * plus spurs (sinusoidal FM), resonant bumps, a constant carrier offset and a linear drift.
 * Defaults: seed 1; every noise term 0; amplitude 1; IF fs/4 (beat); flicker from fs·1e-8 Hz up;
 * no additive noise. A spur is given by its peak deviation Δf (Hz), or by the height it should have
 * in a Welch S_ν with resolution bandwidth (ENBW) `rbwHz`: a line of power Δf²/2 reads
 * (Δf²/2)/ENBW on its bin, so Δf = √(2·height·ENBW).
 */

import { AnalysisInputError } from '../errors';

export type SynthOutput = 'phase' | 'iq' | 'beat' | 'frequency';

export interface SynthSpur {
  frequencyHz: number;
  /** peak frequency deviation Δf, Hz */
  peakDeviationHz?: number;
  /** or: the S_ν height on its bin, Hz²/Hz, in a Welch estimate of ENBW rbwHz */
  heightHz2PerHz?: number;
  rbwHz?: number;
  /** start phase of the modulation, rad (default 0) */
  phaseRad?: number;
}

export interface SynthBump {
  centerHz: number;
  /** −3 dB full width, Hz (W ≪ centre) */
  widthHz: number;
  /** S_ν at the centre, Hz²/Hz (above the rest of the model) */
  peakHz2PerHz: number;
}

export interface SynthOptions {
  sampleRateHz: number;
  output: SynthOutput;
  seed?: number;
  /** h0, Hz²/Hz */
  whiteHz2PerHz?: number;
  /** h₋₁, Hz² */
  flickerHz2?: number;
  /** flicker follows h₋₁/f from here up (default fs·1e-8), Hz */
  flickerLowestHz?: number;
  /** h₋₂, Hz³ */
  randomWalkHz3?: number;
  spurs?: SynthSpur[];
  bumps?: SynthBump[];
  /** constant frequency offset of the carrier, Hz (for 'iq'; for 'beat' it adds to the IF) */
  carrierOffsetHz?: number;
  /** linear frequency drift, Hz/s */
  driftHzPerS?: number;
  /** carrier amplitude A for 'iq' and 'beat' (default 1) */
  amplitude?: number;
  /** 'beat': intermediate frequency, Hz (default fs/4) */
  intermediateFrequencyHz?: number;
  /** white measurement noise added to the output, one-sided density in the output's unit²/Hz
   *  (V²/Hz on each of I and Q, or on the beat voltage; rad²/Hz for 'phase'; Hz²/Hz for 'frequency') */
  additiveNoiseDensity?: number;
  /** start phase φ[−1], rad (default 0) */
  initialPhaseRad?: number;
}

export interface ResolvedSpur {
  frequencyHz: number;
  peakDeviationHz: number;
  phaseRad: number;
}

export interface ResolvedSynthOptions {
  sampleRateHz: number;
  output: SynthOutput;
  seed: number;
  whiteHz2PerHz: number;
  flickerHz2: number;
  flickerLowestHz: number;
  randomWalkHz3: number;
  spurs: ResolvedSpur[];
  bumps: SynthBump[];
  carrierOffsetHz: number;
  driftHzPerS: number;
  amplitude: number;
  intermediateFrequencyHz: number;
  additiveNoiseDensity: number;
  initialPhaseRad: number;
}

const OUTPUTS: readonly SynthOutput[] = ['phase', 'iq', 'beat', 'frequency'];

function nonNegative(value: unknown, name: string, fallback: number): number {
  const v = value ?? fallback;
  if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
    throw new AnalysisInputError(`${name} must be a finite number >= 0, got ${String(value)}`);
  }
  return v;
}

function finite(value: unknown, name: string, fallback: number): number {
  const v = value ?? fallback;
  if (typeof v !== 'number' || !Number.isFinite(v)) {
    throw new AnalysisInputError(`${name} must be a finite number, got ${String(value)}`);
  }
  return v;
}

export function resolveSynthOptions(options: SynthOptions): ResolvedSynthOptions {
  if (options === null || typeof options !== 'object') {
    throw new AnalysisInputError('synthetic-capture options must be an object with sampleRateHz and output');
  }
  const fs = options.sampleRateHz;
  if (typeof fs !== 'number' || !Number.isFinite(fs) || fs <= 0) {
    throw new AnalysisInputError(`sampleRateHz must be a positive finite number, got ${String(fs)}`);
  }
  if (!OUTPUTS.includes(options.output)) {
    throw new AnalysisInputError(`output must be one of ${OUTPUTS.join(', ')}, got ${String(options.output)}`);
  }
  const seed = options.seed ?? 1;
  if (!Number.isInteger(seed) || seed < 0 || seed > 2 ** 44) {
    throw new AnalysisInputError(`seed must be an integer in [0, 2^44], got ${String(seed)}`);
  }
  const flickerLowestHz = options.flickerLowestHz ?? fs * 1e-8;
  if (typeof flickerLowestHz !== 'number' || !(flickerLowestHz > 0 && flickerLowestHz < fs / 20)) {
    throw new AnalysisInputError(`flickerLowestHz must lie in (0, fs/20), got ${String(options.flickerLowestHz)}`);
  }
  const spurs: ResolvedSpur[] = (options.spurs ?? []).map((s, i) => {
    const where = `spurs[${i}]`;
    if (!(typeof s.frequencyHz === 'number' && s.frequencyHz > 0 && s.frequencyHz < fs / 2)) {
      throw new AnalysisInputError(`${where}.frequencyHz must lie in (0, fs/2), got ${String(s.frequencyHz)}`);
    }
    let dev: number;
    if (s.peakDeviationHz !== undefined) {
      if (s.heightHz2PerHz !== undefined) {
        throw new AnalysisInputError(`${where}: give peakDeviationHz or heightHz2PerHz, not both`);
      }
      dev = nonNegative(s.peakDeviationHz, `${where}.peakDeviationHz`, 0);
    } else if (s.heightHz2PerHz !== undefined) {
      const h = nonNegative(s.heightHz2PerHz, `${where}.heightHz2PerHz`, 0);
      if (!(typeof s.rbwHz === 'number' && s.rbwHz > 0 && Number.isFinite(s.rbwHz))) {
        throw new AnalysisInputError(`${where}: heightHz2PerHz needs rbwHz (the ENBW of the Welch estimate), got ${String(s.rbwHz)}`);
      }
      dev = Math.sqrt(2 * h * s.rbwHz); // Δf = √(2·height·ENBW)
    } else {
      throw new AnalysisInputError(`${where}: give peakDeviationHz or heightHz2PerHz`);
    }
    return { frequencyHz: s.frequencyHz, peakDeviationHz: dev, phaseRad: finite(s.phaseRad, `${where}.phaseRad`, 0) };
  });
  if ((options.bumps ?? []).length > 8) {
    throw new AnalysisInputError(`at most 8 bumps, got ${(options.bumps ?? []).length}`);
  }
  const bumps = (options.bumps ?? []).map((b, i) => {
    const where = `bumps[${i}]`;
    if (!(typeof b.centerHz === 'number' && b.centerHz > 0 && b.centerHz < fs / 2)) {
      throw new AnalysisInputError(`${where}.centerHz must lie in (0, fs/2), got ${String(b.centerHz)}`);
    }
    if (!(typeof b.widthHz === 'number' && b.widthHz > 0 && b.widthHz < b.centerHz)) {
      throw new AnalysisInputError(`${where}.widthHz must lie in (0, centerHz), got ${String(b.widthHz)}`);
    }
    if (!(typeof b.peakHz2PerHz === 'number' && b.peakHz2PerHz > 0 && Number.isFinite(b.peakHz2PerHz))) {
      throw new AnalysisInputError(`${where}.peakHz2PerHz must be a positive number, got ${String(b.peakHz2PerHz)}`);
    }
    return { centerHz: b.centerHz, widthHz: b.widthHz, peakHz2PerHz: b.peakHz2PerHz };
  });
  const amplitude = options.amplitude ?? 1;
  if (typeof amplitude !== 'number' || !(amplitude > 0) || !Number.isFinite(amplitude)) {
    throw new AnalysisInputError(`amplitude must be a positive number, got ${String(options.amplitude)}`);
  }
  const fif = options.intermediateFrequencyHz ?? fs / 4;
  if (typeof fif !== 'number' || !(fif > 0 && fif < fs / 2)) {
    throw new AnalysisInputError(`intermediateFrequencyHz must lie in (0, fs/2), got ${String(options.intermediateFrequencyHz)}`);
  }
  if (options.output !== 'beat' && options.intermediateFrequencyHz !== undefined) {
    throw new AnalysisInputError(`intermediateFrequencyHz applies to output 'beat' only (output is '${options.output}')`);
  }
  return {
    sampleRateHz: fs,
    output: options.output,
    seed,
    whiteHz2PerHz: nonNegative(options.whiteHz2PerHz, 'whiteHz2PerHz', 0),
    flickerHz2: nonNegative(options.flickerHz2, 'flickerHz2', 0),
    flickerLowestHz,
    randomWalkHz3: nonNegative(options.randomWalkHz3, 'randomWalkHz3', 0),
    spurs,
    bumps,
    carrierOffsetHz: finite(options.carrierOffsetHz, 'carrierOffsetHz', 0),
    driftHzPerS: finite(options.driftHzPerS, 'driftHzPerS', 0),
    amplitude,
    intermediateFrequencyHz: fif,
    additiveNoiseDensity: nonNegative(options.additiveNoiseDensity, 'additiveNoiseDensity', 0),
    initialPhaseRad: finite(options.initialPhaseRad, 'initialPhaseRad', 0),
  };
}
