/**
 * Equivalent number of independent averages K_eff of a Welch estimate with overlapping segments.
 *
 * Usage:
 *   import { equivalentAverages } from '../analysis/spectrum/equivalent-averages';
 *   equivalentAverages(makeWindow('hann', 256), 128, 40);   // 37.94
 *
 *   1/K_eff = (1/K)·[1 + 2·Σ_{j=1}^{K−1} (1 − j/K)·ρ(j)²],   ρ(j) = Σ_n w[n]·w[n + jD] / Σ_n w[n]²
 * Each averaged bin away from DC and Nyquist is then ≈ P·χ²_ν/ν with ν = 2·K_eff degrees of freedom.
 * Reference: P. D. Welch, "The use of fast Fourier transform for the estimation of power spectra:
 *   a method based on time averaging over short, modified periodograms", IEEE Trans. Audio
 *   Electroacoust. AU-15(2), 70-73 (1967); form as in METHODS 1.3 (Monte-Carlo checked there).
 * Units: K and K_eff are counts; D (hop) in samples. K = 0 gives 0.
 * Worked check: Hann, L = 256, D = 128 (50 %), K = 40 → K_eff = 37.94.
 */

import { AnalysisInputError } from '../errors';

export function equivalentAverages(window: Float64Array, hop: number, segments: number): number {
  const L = window.length;
  if (!Number.isInteger(hop) || hop < 1) {
    throw new AnalysisInputError(`hop must be an integer >= 1, got ${hop}`);
  }
  if (!Number.isInteger(segments) || segments < 0) {
    throw new AnalysisInputError(`segments must be an integer >= 0, got ${segments}`);
  }
  if (segments === 0) return 0;
  let s2 = 0;
  for (let n = 0; n < L; n++) s2 += window[n] * window[n];
  let sum = 0;
  for (let j = 1; j < segments && j * hop < L; j++) {
    const shift = j * hop;
    let c = 0;
    for (let n = 0; n + shift < L; n++) c += window[n] * window[n + shift];
    const rho = c / s2; // window overlap correlation ρ(j)
    sum += (1 - j / segments) * rho * rho;
  }
  return segments / (1 + 2 * sum);
}
