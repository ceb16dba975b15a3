/**
 * Intermediate frequency of a real beat note from the peak of its spectrum.
 *
 * Usage:
 *   import { estimateIntermediateFrequency } from '../analysis/phase/intermediate-frequency';
 *   estimateIntermediateFrequency(v, 20e6);       // ≈ 2.5e6 for a 2.5 MHz beat
 *
 * Method: Welch PSD (Hann, L = the largest power of two ≤ min(N, 8192), 50 % overlap, mean removed);
 * the strongest bin m in 2..⌊L/2⌋−2 is refined by fitting a parabola to the logarithms of bins
 * m−1, m, m+1 (exact for a Gaussian peak; a Hann main lobe is close to one), δ = ½·(a − c)/(a − 2b + c).
 * The IF only sets the mix-down; any error becomes part of the reported carrier offset, so bin-level
 * accuracy (fs/L) is ample. Common practice, no source (peak picking with log-parabolic interpolation).
 * Units: V in, Hz out. Throws AnalysisInputError when N < 64 or when the peak sits at DC or Nyquist.
 * Worked check: cos(2π·0.1234·n), N = 8192 → 0.1234·fs within fs/8192.
 */

import { AnalysisInputError } from '../errors';
import { welch } from '../spectrum/welch';

export function estimateIntermediateFrequency(v: ArrayLike<number>, sampleRateHz: number): number {
  const n = v.length;
  if (n < 64) {
    throw new AnalysisInputError(`need at least 64 samples to find the beat frequency, got ${n}; give intermediateFrequencyHz`);
  }
  let L = 64;
  while (L * 2 <= Math.min(n, 8192)) L *= 2;
  const s = welch(v, { sampleRateHz, segmentLength: L, window: 'hann', overlap: 0.5 });
  const p = s.psd;
  let best = 2;
  for (let m = 2; m <= p.length - 3; m++) if (p[m] > p[best]) best = m;
  // the peak must stand clear of DC and Nyquist
  let maxAll = 0;
  for (let m = 0; m < p.length; m++) if (p[m] > maxAll) maxAll = p[m];
  if (!(p[best] > 0) || p[best] < maxAll) {
    throw new AnalysisInputError(
      'the strongest line of the beat note sits at DC or Nyquist: give intermediateFrequencyHz or check the capture kind',
    );
  }
  const a = Math.log(Math.max(p[best - 1], 1e-300));
  const b = Math.log(p[best]);
  const c = Math.log(Math.max(p[best + 1], 1e-300));
  const den = a - 2 * b + c;
  const delta = den < 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (a - c)) / den)) : 0;
  return ((best + delta) * sampleRateHz) / L;
}
