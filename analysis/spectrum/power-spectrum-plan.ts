/**
 * Squared DFT magnitudes |X[m]|², m = 0..⌊L/2⌋, of a real sequence of any length L, with a reusable plan.
 *
 * Usage:
 *   import { createPowerSpectrumPlan } from '../analysis/spectrum/power-spectrum-plan';
 *   const plan = createPowerSpectrumPlan(4096);          // plan.bins = 2049
 *   plan.accumulate(segment, acc);                       // acc[m] += |X[m]|²
 *
 * L a power of two (≥ 2): fft.js real transform (radix-4, Indutny) on preallocated buffers.
 * Other L: Bluestein's chirp-z algorithm (analysis/spectrum/bluestein.ts) on fft.js.
 * X[m] = Σ_n x[n]·e^{−2πi·mn/L} (no scaling here; Welch applies its own).
 * Worked check: L = 4, x = [1, 1, 1, 1] → |X|² = [16, 0, 0].
 */

import FFT from 'fft.js';
import { AnalysisInputError } from '../errors';
import { createBluesteinDft } from './bluestein';

export interface PowerSpectrumPlan {
  readonly length: number;
  /** ⌊L/2⌋ + 1 one-sided bins */
  readonly bins: number;
  readonly method: 'radix-4' | 'bluestein';
  /** out[m] = |X[m]|² for m < bins (x has length ≥ L; only the first L samples are used) */
  compute(x: Float64Array, out: Float64Array): void;
  /** acc[m] += |X[m]|² for m < bins */
  accumulate(x: Float64Array, acc: Float64Array): void;
}

function isPowerOfTwo(n: number): boolean {
  return n >= 2 && (n & (n - 1)) === 0;
}

export function createPowerSpectrumPlan(length: number): PowerSpectrumPlan {
  if (!Number.isInteger(length) || length < 2) {
    throw new AnalysisInputError(`segment length must be an integer >= 2, got ${length}`);
  }
  const L = length;
  const bins = Math.floor(L / 2) + 1;
  if (isPowerOfTwo(L) && L <= 2 ** 30) {
    const fft = new FFT(L);
    const out = new Float64Array(2 * L);
    const run = (x: Float64Array, target: Float64Array, add: boolean): void => {
      // fft.js reads data[0..L−1]; a longer x is fine
      fft.realTransform(out, x);
      for (let m = 0; m < bins; m++) {
        const p = out[2 * m] * out[2 * m] + out[2 * m + 1] * out[2 * m + 1];
        target[m] = add ? target[m] + p : p;
      }
    };
    return {
      length: L,
      bins,
      method: 'radix-4',
      compute: (x, target) => run(x, target, false),
      accumulate: (x, acc) => run(x, acc, true),
    };
  }
  const dft = createBluesteinDft(L);
  return {
    length: L,
    bins,
    method: 'bluestein',
    compute: (x, target) => dft.realPower(x, target, bins, false),
    accumulate: (x, acc) => dft.realPower(x, acc, bins, true),
  };
}
