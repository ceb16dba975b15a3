/**
 * DFT of any length L by Bluestein's chirp-z algorithm on power-of-two FFTs (fft.js).
 *
 * Usage:
 *   import { createBluesteinDft } from '../analysis/spectrum/bluestein';
 *   const dft = createBluesteinDft(1000);
 *   dft.transform(re, im, outRe, outIm);      // X[m] = Σ_n x[n]·e^{−2πi·mn/L}, m = 0..L−1
 *
 * Method: mn = (m² + n² − (m−n)²)/2, so X[m] = c[m]·Σ_n (x[n]·c[n])·conj(c[m−n]) with the chirp
 * c[n] = e^{−iπn²/L}: a linear convolution, done as a circular one of power-of-two size M ≥ 2L−1.
 * The FFT of the conjugate chirp is computed once per plan; each transform costs one forward and one
 * inverse FFT of size M and allocates nothing. n² is reduced modulo 2L before the sine/cosine so the
 * chirp stays exact for large L.
 * Reference: L. I. Bluestein, "A linear filtering approach to the computation of discrete Fourier
 *   transform", IEEE Trans. Audio Electroacoust. 18(4), 451-455 (1970); L. R. Rabiner, R. W. Schafer,
 *   C. M. Rader, "The chirp z-transform algorithm", IEEE Trans. Audio Electroacoust. 17(2), 86-92 (1969).
 * Worked check: L = 3, x = [1, 0, 0] → X = [1, 1, 1] (tests compare against a naive DFT for many L).
 */

import FFT from 'fft.js';
import { AnalysisInputError } from '../errors';

export interface BluesteinDft {
  readonly length: number;
  /** power-of-two size of the inner FFTs */
  readonly fftSize: number;
  /** X = DFT(re + i·im); outputs have length ≥ L; inputs are not modified */
  transform(re: ArrayLike<number>, im: ArrayLike<number> | null, outRe: Float64Array, outIm: Float64Array): void;
  /** |X[m]|² for m = 0..count−1 of a real input x, written (or added, when `add`) into out */
  realPower(x: ArrayLike<number>, out: Float64Array, count: number, add: boolean): void;
}

export function nextPowerOfTwo(n: number): number {
  let p = 1;
  while (p < n) p *= 2;
  return p;
}

export function createBluesteinDft(length: number): BluesteinDft {
  if (!Number.isInteger(length) || length < 1) {
    throw new AnalysisInputError(`DFT length must be an integer >= 1, got ${length}`);
  }
  const L = length;
  const M = Math.max(2, nextPowerOfTwo(2 * L - 1));
  const fft = new FFT(M);
  // chirp c[n] = e^{−iπ n²/L}
  const chirpRe = new Float64Array(L);
  const chirpIm = new Float64Array(L);
  const twoL = 2 * L;
  for (let n = 0; n < L; n++) {
    const q = (n * n) % twoL; // exact: n² < 2^53 for any L we accept
    const angle = (Math.PI * q) / L;
    chirpRe[n] = Math.cos(angle);
    chirpIm[n] = -Math.sin(angle);
  }
  // FFT of b[k] = conj(c[k]) on k = −(L−1)..(L−1), stored circularly in M points
  const b = new Float64Array(2 * M);
  for (let k = 0; k < L; k++) {
    b[2 * k] = chirpRe[k];
    b[2 * k + 1] = -chirpIm[k];
    if (k > 0) {
      b[2 * (M - k)] = chirpRe[k];
      b[2 * (M - k) + 1] = -chirpIm[k];
    }
  }
  const bHat = new Float64Array(2 * M);
  fft.transform(bHat, b);
  const work = new Float64Array(2 * M);
  const workHat = new Float64Array(2 * M);

  // y = IFFT(FFT(a)·B̂) with a[n] = x[n]·c[n]; leaves the convolution in `work`
  function convolve(): void {
    fft.transform(workHat, work);
    for (let i = 0; i < 2 * M; i += 2) {
      const ar = workHat[i];
      const ai = workHat[i + 1];
      const br = bHat[i];
      const bi = bHat[i + 1];
      workHat[i] = ar * br - ai * bi;
      workHat[i + 1] = ar * bi + ai * br;
    }
    fft.inverseTransform(work, workHat);
  }

  return {
    length: L,
    fftSize: M,
    transform(re, im, outRe, outIm) {
      work.fill(0);
      for (let n = 0; n < L; n++) {
        const xr = re[n];
        const xi = im ? im[n] : 0;
        work[2 * n] = xr * chirpRe[n] - xi * chirpIm[n];
        work[2 * n + 1] = xr * chirpIm[n] + xi * chirpRe[n];
      }
      convolve();
      for (let m = 0; m < L; m++) {
        const yr = work[2 * m];
        const yi = work[2 * m + 1];
        outRe[m] = yr * chirpRe[m] - yi * chirpIm[m];
        outIm[m] = yr * chirpIm[m] + yi * chirpRe[m];
      }
    },
    realPower(x, out, count, add) {
      work.fill(0);
      for (let n = 0; n < L; n++) {
        work[2 * n] = x[n] * chirpRe[n];
        work[2 * n + 1] = x[n] * chirpIm[n];
      }
      convolve();
      // |X[m]|² = |c[m]·y[m]|² = |y[m]|² (the post-chirp has unit modulus)
      for (let m = 0; m < count; m++) {
        const p = work[2 * m] * work[2 * m] + work[2 * m + 1] * work[2 * m + 1];
        out[m] = add ? out[m] + p : p;
      }
    },
  };
}
