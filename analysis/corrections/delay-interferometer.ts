/**
 * A phase record taken through an unbalanced interferometer (delay τ) — a frequency discriminator —
 * turned back into the laser's frequency noise by dividing out the interferometer's transfer function,
 * with the bins near its zeros masked and reported as masked.
 *
 * Usage:
 *   import { correctDelayInterferometer } from '../analysis/corrections/delay-interferometer';
 *   const r = correctDelayInterferometer(phaseDifferenceSpectrum, { delayS: 5e-6 });
 *   r.spectrum (unmasked bins of S_ν, Hz²/Hz); r.masked; r.maskedRangesHz; r.firstZeroHz
 *
 * Physics (Phaseloom METHODS 4.3): the demodulated phase is Δφ(t) = φ(t) − φ(t − τ), so
 *   |H(f)|² = |1 − e^{−i2πfτ}|² = 4 sin²(πfτ),  S_Δφ = 4 sin²(πfτ)·S_φ,
 *   S_ν(f) = f²·S_Δφ(f) / (4 sin²(πfτ))          (S_φ = S_ν/f²).
 * Low-f limit S_ν ≈ S_Δφ/(2πτ)² (discriminator slope 2πτ rad/Hz). At the zeros f_n = n/τ the division
 * diverges (n ≥ 1) and the estimate is noise: bins with 4 sin²(πfτ) < 0.1 (|fτ − n| < 0.0506, n ≥ 1) are
 * masked (default threshold 0.1, METHODS 4.3). Towards f = 0 the correction stays finite (1/(2πτ)²), so only
 * the f = 0 bin itself is masked there.
 * Input: one-sided S_Δφ in rad²/Hz (e.g. a Welch estimate of the demodulated phase). Output: the unmasked
 * bins of S_ν as a Spectrum; on the input grid, S_ν (0 where masked) and the mask; the masked bins as
 * contiguous ranges [first, last] Hz.
 * Worked check: S_ν = 1e4 Hz²/Hz → S_Δφ = 4 sin²(πfτ)·1e4/f² → back to 1e4 in every unmasked bin.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

export interface DelayInterferometerOptions {
  /** τ, s */
  delayS: number;
  /** bins with 4 sin²(πfτ) below this are masked; default 0.1 */
  maskThreshold?: number;
}

export interface DelayInterferometerCorrection {
  /** unmasked bins of S_ν, Hz²/Hz */
  spectrum: Spectrum;
  frequencyHz: Float64Array;
  /** S_ν on the input grid, 0 where masked */
  frequencyNoiseHz2PerHz: Float64Array;
  /** 1 where masked */
  masked: Uint8Array;
  maskedCount: number;
  maskedRangesHz: [number, number][];
  /** 1/τ: the first zero of the transfer function */
  firstZeroHz: number;
  /** 2πτ, rad/Hz */
  discriminatorSlopeRadPerHz: number;
  warnings: string[];
}

/** |1 − e^{−i2πfτ}|² = 4 sin²(πfτ). */
export function delayInterferometerGain(frequencyHz: number, delayS: number): number {
  const s = Math.sin(Math.PI * frequencyHz * delayS);
  return 4 * s * s;
}

export function correctDelayInterferometer(phaseDifference: Spectrum, options: DelayInterferometerOptions): DelayInterferometerCorrection {
  const f = phaseDifference?.frequencyHz;
  const s = phaseDifference?.psd;
  if (!(f instanceof Float64Array) || !(s instanceof Float64Array) || f.length !== s.length || f.length < 2) {
    throw new AnalysisInputError('the phase-difference spectrum must hold frequencyHz and psd as Float64Arrays of equal length (>= 2)');
  }
  const tau = options?.delayS;
  if (!(typeof tau === 'number' && Number.isFinite(tau) && tau > 0)) {
    throw new AnalysisInputError(`the interferometer delay must be a positive number of seconds, got ${String(tau)}`, 'delayS');
  }
  const threshold = options.maskThreshold ?? 0.1;
  if (!(typeof threshold === 'number' && threshold > 0 && threshold < 4)) {
    throw new AnalysisInputError(`maskThreshold must lie in (0, 4), got ${String(threshold)}`, 'maskThreshold');
  }
  const n = f.length;
  const out = new Float64Array(n);
  const masked = new Uint8Array(n);
  let count = 0;
  for (let i = 0; i < n; i++) {
    if (!(Number.isFinite(f[i]) && f[i] >= 0 && Number.isFinite(s[i]) && s[i] >= 0)) {
      throw new AnalysisInputError('frequencies and S_Δφ must be finite and >= 0', `point ${i}`);
    }
    if (i > 0 && !(f[i] > f[i - 1])) throw new AnalysisInputError('frequencies must increase strictly', `point ${i}`);
    const h2 = delayInterferometerGain(f[i], tau);
    // the correction f²/(4 sin²(πfτ)) diverges at the zeros n/τ with n ≥ 1; towards f = 0 it tends to 1/(2πτ)²
    if (f[i] === 0 || (h2 < threshold && f[i] * tau > 0.5)) {
      masked[i] = 1;
      count++;
      continue;
    }
    out[i] = (f[i] * f[i] * s[i]) / h2; // S_ν = f² S_Δφ / (4 sin²(πfτ))
  }
  const ranges: [number, number][] = [];
  for (let i = 0; i < n; i++) {
    if (masked[i] && (i === 0 || !masked[i - 1])) ranges.push([f[i], f[i]]);
    if (masked[i]) ranges[ranges.length - 1][1] = f[i];
  }
  const keptF = new Float64Array(n - count);
  const keptS = new Float64Array(n - count);
  for (let i = 0, j = 0; i < n; i++) {
    if (!masked[i]) {
      keptF[j] = f[i];
      keptS[j++] = out[i];
    }
  }
  const warnings: string[] = [];
  const top = f[n - 1];
  if (top * tau >= 0.9) {
    warnings.push(
      `the spectrum reaches ${top.toPrecision(3)} Hz, beyond 0.9/τ = ${(0.9 / tau).toPrecision(3)} Hz: ${ranges.length} notch region(s) near the zeros n/τ are masked; ` +
        'between them the estimate rests on a small transfer function — prefer f < 0.9/τ or combine two delays',
    );
  }
  return {
    spectrum: { frequencyHz: keptF, psd: keptS },
    frequencyHz: f,
    frequencyNoiseHz2PerHz: out,
    masked,
    maskedCount: count,
    maskedRangesHz: ranges,
    firstZeroHz: 1 / tau,
    discriminatorSlopeRadPerHz: 2 * Math.PI * tau,
    warnings,
  };
}
