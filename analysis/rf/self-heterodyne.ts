/**
 * Delayed self-heterodyne (DSH): the laser linewidth from the width of its beat with a delayed,
 * frequency-shifted copy of itself, the assumption that makes it valid, and the closed-form beat of a
 * white-frequency-noise laser for delays that are not long.
 *
 * Usage:
 *   import { selfHeterodyneLinewidth, dshBeatFwhm } from '../analysis/rf/self-heterodyne';
 *   const r = selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: 62.8e3, fiberLengthM: 25e3 });
 *   r.laserLinewidthHz; r.assumption; r.delayLinewidthProduct; r.warnings
 *   dshBeatFwhm(1e4, 1e-4) / (2 * 1e4);   // 1.0117 (τ_d Δν = 1)
 *
 * Method: T. Okoshi, K. Kikuchi, A. Nakayama, "Novel method for high resolution measurement of laser
 * output spectrum", Electron. Lett. 16(16), 630 (1980) (volume/page from memory). With the delay τ_d long
 * against the coherence time the two arms are uncorrelated and the beat is the autoconvolution of the
 * line (Phaseloom METHODS 4.2): Lorentzian beat FWHM = 2Δν, so Δν = beat/2; Gaussian beat = √2·f_G; Voigt
 * beat parts f_L,DSH = 2 f_L, f_G,DSH = √2 f_G (laser Voigt FWHM by Olivero & Longbothum). With 1/f
 * noise the width depends on τ_d (L. B. Mercer, J. Lightwave Technol. 9(4), 485 (1991)).
 * Closed form for white FM (laser FWHM Δν), offset f from the shift frequency, per unit power [METHODS 4.2,
 * same form as Richter et al., IEEE J. Quantum Electron. 22, 2070 (1986), from memory]:
 *   S(f) = e^{−2πΔντ_d} δ(f) + Δν/(π(Δν² + f²)) · [1 − e^{−2πΔντ_d}(cos 2πfτ_d + (Δν/f) sin 2πfτ_d)]
 * Its continuous part's FWHM / (2Δν): 1.775 at τ_dΔν = 0.3, 1.253 at 0.5, 1.080 at 0.7, 1.012 at 1, 1.0000 at 2
 * — hence the warning when τ_d·Δν < 1, and, for a Lorentzian, the linewidth found by inverting the closed
 * form (shortDelayLinewidthHz; the FWHM tends to 0.886/τ_d as Δν → 0, so narrower beats cannot be inverted).
 * Delay: given, or fibre length × group index / c (default group index 1.468, a typical single-mode fibre
 * value near 1550 nm — from memory).
 * Worked check: beat FWHM 62.832 kHz (h0 = 1e4) → Δν = 31.416 kHz.
 */

import { AnalysisInputError } from '../errors';
import { brentRoot } from '../linewidth/brent-root';
import { SPEED_OF_LIGHT_M_PER_S } from '../units';
import { voigtFwhmOliveroLongbothum } from './voigt-width';

export type DshLineShape = 'lorentzian' | 'gaussian' | 'voigt';

export interface SelfHeterodyneInput {
  shape: DshLineShape;
  /** Lorentzian or Gaussian beat FWHM, Hz */
  beatFwhmHz?: number;
  /** Voigt beat: its Lorentzian and Gaussian FWHMs, Hz */
  beatLorentzianFwhmHz?: number;
  beatGaussianFwhmHz?: number;
  /** delay τ_d, s; or fiberLengthM with groupIndex */
  delayS?: number;
  fiberLengthM?: number;
  groupIndex?: number;
}

export interface SelfHeterodyneResult {
  shape: DshLineShape;
  /** the laser FWHM under the long-delay assumption, Hz */
  laserLinewidthHz: number;
  laserLorentzianFwhmHz: number | null;
  laserGaussianFwhmHz: number | null;
  assumption: string;
  delayS: number | null;
  /** τ_d × the laser's (Lorentzian part of the) FWHM; null without a delay */
  delayLinewidthProduct: number | null;
  /** Lorentzian with τ_d·Δν < 2: Δν whose closed-form beat has the measured FWHM (null when not applicable) */
  shortDelayLinewidthHz: number | null;
  warnings: string[];
}

export const DEFAULT_FIBER_GROUP_INDEX = 1.468;
const SHAPES: readonly DshLineShape[] = ['lorentzian', 'gaussian', 'voigt'];

/** Continuous part of the DSH beat of a white-FM laser (FWHM Δν) at offset f, per unit total power, 1/Hz. */
export function dshBeatSpectrum(offsetHz: number, linewidthHz: number, delayS: number): number {
  const f = Math.abs(offsetHz);
  const dnu = linewidthHz;
  const a = Math.exp(-2 * Math.PI * dnu * delayS);
  if (f === 0) {
    // limit f → 0: (1 − e^{−x}(1 + x))/(πΔν), x = 2πΔντ_d; a series for small x (no cancellation)
    const x = 2 * Math.PI * dnu * delayS;
    const c = x < 1e-2 ? Math.exp(-x) * x * x * (0.5 + x * (1 / 6 + x * (1 / 24 + x / 120))) : 1 - a * (1 + x);
    return c / (Math.PI * dnu);
  }
  const phase = 2 * Math.PI * f * delayS;
  return (dnu / (Math.PI * (dnu * dnu + f * f))) * (1 - a * (Math.cos(phase) + (dnu / f) * Math.sin(phase)));
}

/** FWHM of the continuous part of the DSH beat (first half-maximum crossing from the centre), Hz. */
export function dshBeatFwhm(linewidthHz: number, delayS: number): number {
  if (!(linewidthHz > 0 && Number.isFinite(linewidthHz))) throw new AnalysisInputError(`linewidthHz must be > 0, got ${linewidthHz}`);
  if (!(delayS > 0 && Number.isFinite(delayS))) throw new AnalysisInputError(`delayS must be > 0, got ${delayS}`);
  const half = dshBeatSpectrum(0, linewidthHz, delayS) / 2;
  const g = (f: number) => dshBeatSpectrum(f, linewidthHz, delayS) - half;
  // the width scales as 2Δν (long delay) or 0.886/τ_d (short): step through the main lobe in 1/64 of the larger
  const step = Math.max(linewidthHz, 1 / delayS) / 64;
  let x = step;
  let prev = 0;
  for (let i = 0; i < 1e6 && g(x) > 0; i++) {
    prev = x;
    x += step;
  }
  return 2 * brentRoot(g, prev, x, 1e-13 * x);
}

function positive(v: unknown, name: string): number {
  if (!(typeof v === 'number' && Number.isFinite(v) && v > 0)) throw new AnalysisInputError(`${name} must be a positive finite number, got ${String(v)}`);
  return v;
}

export function selfHeterodyneLinewidth(input: SelfHeterodyneInput): SelfHeterodyneResult {
  if (!input || !SHAPES.includes(input.shape)) {
    throw new AnalysisInputError(`shape must be one of ${SHAPES.join(', ')}, got ${String(input?.shape)}`);
  }
  let delay: number | null = null;
  if (input.delayS !== undefined) {
    if (input.fiberLengthM !== undefined) throw new AnalysisInputError('give delayS or fiberLengthM, not both');
    delay = positive(input.delayS, 'delayS');
  } else if (input.fiberLengthM !== undefined) {
    const n = input.groupIndex === undefined ? DEFAULT_FIBER_GROUP_INDEX : positive(input.groupIndex, 'groupIndex');
    delay = (positive(input.fiberLengthM, 'fiberLengthM') * n) / SPEED_OF_LIGHT_M_PER_S; // τ_d = n_g·L/c
  } else if (input.groupIndex !== undefined) {
    throw new AnalysisInputError('groupIndex needs fiberLengthM');
  }
  const warnings: string[] = [];
  let laser: number;
  let lor: number | null = null;
  let gau: number | null = null;
  let assumption: string;
  if (input.shape === 'voigt') {
    const bl = input.beatLorentzianFwhmHz;
    const bg = input.beatGaussianFwhmHz;
    if (!(typeof bl === 'number' && bl >= 0 && Number.isFinite(bl)) || !(typeof bg === 'number' && bg >= 0 && Number.isFinite(bg)) || bl + bg <= 0) {
      throw new AnalysisInputError(`a Voigt beat needs beatLorentzianFwhmHz and beatGaussianFwhmHz (>= 0, not both 0), got ${String(bl)} and ${String(bg)}`);
    }
    lor = bl / 2; // f_L,DSH = 2 f_L
    gau = bg / Math.SQRT2; // f_G,DSH = √2 f_G
    laser = voigtFwhmOliveroLongbothum(lor, gau);
    assumption =
      'delay long against the coherence time (the two arms uncorrelated): the beat is the autoconvolution of the line, ' +
      'so the laser Lorentzian part is half the beat Lorentzian part and the Gaussian part the beat Gaussian part over √2';
  } else {
    const b = positive(input.beatFwhmHz, 'beatFwhmHz');
    if (input.shape === 'lorentzian') {
      laser = b / 2;
      lor = laser;
      assumption =
        'delay long against the coherence time (the two arms uncorrelated): the beat of a Lorentzian line is a Lorentzian ' +
        'twice as wide, so the laser linewidth is half the beat width';
    } else {
      laser = b / Math.SQRT2;
      gau = laser;
      assumption =
        'delay long against the coherence time: the beat of a Gaussian line is √2 times wider; with 1/f noise the ' +
        'width still depends on the delay, which acts as an observation time (Mercer 1991)';
    }
  }
  let product: number | null = null;
  let shortDelay: number | null = null;
  if (delay !== null) {
    const reference = lor !== null && lor > 0 ? lor : laser;
    product = delay * reference;
    if (product < 1) {
      warnings.push(
        `the delay is too short: τ_d·Δν = ${product.toPrecision(3)} < 1, so the arms are still correlated and the beat is not the ` +
          'autoconvolution of the line (for white frequency noise its width is 1.012× the long-delay value at τ_d·Δν = 1, 1.253× at 0.5, 1.775× at 0.3)',
      );
    }
    if (input.shape === 'lorentzian' && product < 2) {
      const beat = input.beatFwhmHz as number;
      const smallest = 1e-4 / delay;
      const floor = dshBeatFwhm(smallest, delay);
      if (beat > floor) {
        shortDelay = brentRoot((d) => dshBeatFwhm(d, delay) - beat, smallest, (beat / 2) * 1.000001, 1e-10 * beat);
      } else {
        warnings.push(`the beat (${beat.toPrecision(4)} Hz) is narrower than the narrowest this delay can show (${floor.toPrecision(4)} Hz): resolution-limited`);
      }
    }
  } else {
    warnings.push('no delay given: the long-delay assumption cannot be checked');
  }
  return {
    shape: input.shape,
    laserLinewidthHz: laser,
    laserLorentzianFwhmHz: lor,
    laserGaussianFwhmHz: gau,
    assumption,
    delayS: delay,
    delayLinewidthProduct: product,
    shortDelayLinewidthHz: shortDelay,
    warnings,
  };
}
