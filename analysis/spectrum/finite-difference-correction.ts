/**
 * The transfer of the first-difference frequency estimate, and its optional correction.
 *
 * Usage:
 *   import { finiteDifferenceGain, correctFiniteDifference } from '../analysis/spectrum/finite-difference-correction';
 *   1 / finiteDifferenceGain(0.25e6, 1e6);            // 1.23370 (f/fs = 0.25)
 *   const corrected = correctFiniteDifference(spectrum, 1e6);
 *
 * ν̂[k] = fs/(2π)·(φ[k] − φ[k−1]) has, against the ideal differentiator, the power transfer
 * sinc²(f/fs), sinc(x) = sin(πx)/(πx) (METHODS 2.4, derived there). It is NOT divided out by default:
 * for a phase sampled from a continuous process with white FM, aliasing of the phase exactly cancels
 * it and the differenced series is white with level h₀ up to Nyquist. Divide by it only when S_ν is
 * band-limited well below fs/2 before sampling (a phase meter with its own low-pass).
 * Units: f and fs in Hz; the spectrum keeps its unit. Worked check: f/fs = 0.25 → 1/sinc² = π²/8 = 1.23370.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

/** sinc²(f/fs): power transfer of the first difference relative to d/dt. */
export function finiteDifferenceGain(frequencyHz: number, sampleRateHz: number): number {
  const x = frequencyHz / sampleRateHz;
  if (x === 0) return 1;
  const s = Math.sin(Math.PI * x) / (Math.PI * x);
  return s * s;
}

/** S_ν / sinc²(f/fs) on the same grid (a new spectrum); only for S_ν band-limited before sampling. */
export function correctFiniteDifference(spectrum: Spectrum, sampleRateHz: number): Spectrum {
  if (!(Number.isFinite(sampleRateHz) && sampleRateHz > 0)) {
    throw new AnalysisInputError(`sampleRateHz must be a positive finite number, got ${sampleRateHz}`);
  }
  const n = spectrum.psd.length;
  const psd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const f = spectrum.frequencyHz[i];
    if (f > sampleRateHz / 2) {
      throw new AnalysisInputError(`frequency ${f} Hz lies above fs/2 = ${sampleRateHz / 2} Hz`);
    }
    psd[i] = spectrum.psd[i] / finiteDifferenceGain(f, sampleRateHz); // ÷ sinc²(f/fs)
  }
  return { frequencyHz: Float64Array.from(spectrum.frequencyHz), psd };
}
