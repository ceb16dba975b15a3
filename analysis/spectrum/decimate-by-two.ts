/**
 * Streaming decimation by 2 behind a binomial low-pass (1 + z⁻¹)^q / 2^q (a one-stage CIC filter).
 *
 * Usage:
 *   import { createDecimatorByTwo, binomialPowerGain } from '../analysis/spectrum/decimate-by-two';
 *   const d = createDecimatorByTwo(6);
 *   const y = d.push(x);                         // half as many samples, rate fs/2
 *   binomialPowerGain(f, fs, 6);                 // |H(f)|² = cos^{2q}(π f / fs), to divide out
 *
 * y[k] = Σ_j C(q, j)·x[2k + q − j] / 2^q: only outputs whose q + 1 taps lie inside the data are
 * emitted (the first q inputs fill the filter), every second one kept. The q-fold zero at the input
 * Nyquist suppresses exactly the band that folds onto the lowest frequencies of the decimated series,
 * which are the only ones the log-frequency cascade reads (f ≤ fs_out/8): there the alias is below
 * sin^{2q}(π/16) = −85 dB for q = 6, and the known droop cos^{2q}(πf/fs) is divided out afterwards.
 * Reference: E. B. Hogenauer, "An economical class of digital filters for decimation and
 *   interpolation", IEEE Trans. Acoust. Speech Signal Process. 29(2), 155-162 (1981) (CIC filters;
 *   here with rate change 2 and differential delay 1, written as its binomial FIR).
 * Worked check: a constant passes unchanged; q = 2 on [0, 4, 0, 4, 0, …] gives 2, 2, …
 */

import { AnalysisInputError } from '../errors';

export interface DecimatorByTwo {
  readonly order: number;
  push(x: ArrayLike<number>): Float64Array;
}

export function binomialCoefficients(q: number): Float64Array {
  const c = new Float64Array(q + 1);
  c[0] = 1;
  for (let k = 1; k <= q; k++) for (let j = k; j > 0; j--) c[j] += c[j - 1];
  const scale = 2 ** q;
  for (let j = 0; j <= q; j++) c[j] /= scale;
  return c;
}

/** Power gain |(1 + e^{−iω})^q / 2^q|² = cos^{2q}(ω/2), ω = 2π f/fs. */
export function binomialPowerGain(frequencyHz: number, sampleRateHz: number, order: number): number {
  const c = Math.cos((Math.PI * frequencyHz) / sampleRateHz);
  return Math.pow(c * c, order);
}

export function createDecimatorByTwo(order: number): DecimatorByTwo {
  if (!Number.isInteger(order) || order < 1 || order > 16) {
    throw new AnalysisInputError(`decimator order must be an integer in [1, 16], got ${order}`);
  }
  const q = order;
  const c = binomialCoefficients(q);
  const history = new Float64Array(q); // the last q inputs, oldest first
  let have = 0; // inputs seen, capped at q
  let phase = 0; // parity of the next full-support output (0 = keep)
  let work = new Float64Array(0);
  return {
    order: q,
    push(x) {
      const n = x.length;
      if (work.length < q + n) work = new Float64Array(q + n);
      // work = [history (have samples) | x]
      const h0 = q - have;
      for (let j = 0; j < have; j++) work[j] = history[h0 + j];
      if (ArrayBuffer.isView(x)) work.set(x as Float64Array, have); // typed arrays: block copy
      else for (let j = 0; j < n; j++) work[have + j] = x[j];
      const total = have + n;
      const outs = Math.max(0, total - q); // full-support outputs available
      const out = new Float64Array(Math.ceil(outs / 2) + 1);
      let count = 0;
      const half = q >> 1;
      const odd = q & 1;
      // y = Σ_j c[j]·x[t − j], t = k + q the newest input; c is symmetric, so pair x[t−j] with x[t−q+j]
      if (q === 6) {
        // the default order, unrolled: (1, 6, 15, 20, 15, 6, 1)/64
        const c0 = c[0];
        const c1 = c[1];
        const c2 = c[2];
        const c3 = c[3];
        for (let k = phase; k < outs; k += 2) {
          out[count++] =
            c0 * (work[k + 6] + work[k]) + c1 * (work[k + 5] + work[k + 1]) + c2 * (work[k + 4] + work[k + 2]) + c3 * work[k + 3];
        }
      } else {
        for (let k = phase; k < outs; k += 2) {
          const t = k + q;
          let s = odd ? 0 : c[half] * work[t - half];
          for (let j = 0; j < half + odd; j++) s += c[j] * (work[t - j] + work[k + j]);
          out[count++] = s;
        }
      }
      phase = (phase + outs) & 1;
      // keep the last q inputs
      const keep = Math.min(q, total);
      for (let j = 0; j < keep; j++) history[q - keep + j] = work[total - keep + j];
      have = keep;
      return out.subarray(0, count);
    },
  };
}
