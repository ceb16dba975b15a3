/**
 * Linear-phase FIR low-pass by the window method: a truncated ideal (sinc) response times a
 * 4-term Blackman-Harris window.
 *
 * Usage:
 *   import { designLowpassFir, lowpassTapCount } from '../analysis/phase/lowpass-fir';
 *   const taps = lowpassTapCount(10e6, 1.875e6, 2.5e6);   // pass band edge, stop band edge → 129 taps
 *   const h = designLowpassFir(10e6, (1.875e6 + 2.5e6) / 2, taps);
 *
 *   h[n] = (2fc/fs)·sinc(2fc/fs·(n − (M−1)/2))·w[n], n = 0..M−1, then scaled so Σh = 1 (unit DC gain)
 * w is the symmetric 4-term Blackman-Harris window (side lobes −92 dB), whose main lobe is 8 bins
 * wide: the transition band is ≈ 8·fs/M, so M = ⌈8·fs/(f_stop − f_pass)⌉ (made odd) with the cut-off
 * fc (−6 dB point) midway; pass-band ripple and stop-band level are both ≈ 1e-4·5 or better.
 * References: A. V. Oppenheim, R. W. Schafer, "Discrete-Time Signal Processing", 3rd ed., Prentice
 *   Hall (2010), §7.5 (design of FIR filters by windowing); F. J. Harris, Proc. IEEE 66(1), 51-83 (1978).
 * Units: Hz in; dimensionless taps out. Worked check: fc = fs/4 gives h[(M−1)/2 ± 2k] = 0 (half-band).
 */

import { AnalysisInputError } from '../errors';

const BH4 = [0.35875, 0.48829, 0.14128, 0.01168];

/** Odd tap count for a transition from fPass to fStop at sample rate fs. */
export function lowpassTapCount(sampleRateHz: number, passHz: number, stopHz: number): number {
  if (!(stopHz > passHz) || !(passHz >= 0)) {
    throw new AnalysisInputError(`the stop-band edge (${stopHz} Hz) must lie above the pass-band edge (${passHz} Hz)`);
  }
  let m = Math.ceil((8 * sampleRateHz) / (stopHz - passHz));
  if (m % 2 === 0) m++;
  return Math.max(m, 3);
}

export function designLowpassFir(sampleRateHz: number, cutoffHz: number, taps: number): Float64Array {
  if (!Number.isInteger(taps) || taps < 1) {
    throw new AnalysisInputError(`taps must be an integer >= 1, got ${taps}`);
  }
  if (!(cutoffHz > 0 && cutoffHz < sampleRateHz / 2)) {
    throw new AnalysisInputError(`cut-off must lie in (0, fs/2) = (0, ${sampleRateHz / 2}) Hz, got ${cutoffHz}`);
  }
  const M = taps;
  const h = new Float64Array(M);
  const c = (2 * cutoffHz) / sampleRateHz; // normalised cut-off, 1 = Nyquist
  const mid = (M - 1) / 2;
  let sum = 0;
  for (let n = 0; n < M; n++) {
    const x = n - mid;
    const ideal = x === 0 ? c : Math.sin(Math.PI * c * x) / (Math.PI * x);
    // symmetric window: z = 2πn/(M−1)
    const z = M > 1 ? (2 * Math.PI * n) / (M - 1) : 0;
    const w = BH4[0] - BH4[1] * Math.cos(z) + BH4[2] * Math.cos(2 * z) - BH4[3] * Math.cos(3 * z);
    h[n] = ideal * w;
    sum += h[n];
  }
  for (let n = 0; n < M; n++) h[n] /= sum; // unit DC gain
  return h;
}
