/**
 * Streaming FIR filtering of a complex series by FFT overlap-save, with optional decimation.
 *
 * Usage:
 *   import { createOverlapSaveFilter } from '../analysis/phase/overlap-save';
 *   const f = createOverlapSaveFilter(h, { decimation: 1 });
 *   const y = f.push(re, im);     // { re, im } of the outputs completed by this block
 *   const last = f.finish();
 *
 * Output k is y[k] = Σ_j h[j]·x[k + M − 1 − j], i.e. only outputs whose M-tap support lies wholly
 * inside the data are emitted (N inputs → N − M + 1 outputs, then every D-th kept); the delay is
 * (M − 1)/2 input samples. Each frame of P = FFT size inputs (the first M − 1 repeated from the
 * previous frame) gives P − M + 1 outputs: one forward and one inverse complex FFT (fft.js) on
 * preallocated buffers. Reference: A. V. Oppenheim, R. W. Schafer, "Discrete-Time Signal
 * Processing", 3rd ed. (2010), §8.7.3 (block convolution, overlap-save).
 * Worked check: h = [1] passes the input through unchanged.
 */

import FFT from 'fft.js';
import { AnalysisInputError } from '../errors';
import { nextPowerOfTwo } from '../spectrum/bluestein';

export interface ComplexBlock {
  re: Float64Array;
  im: Float64Array;
}

export interface OverlapSaveFilter {
  readonly taps: number;
  readonly fftSize: number;
  push(re: ArrayLike<number>, im: ArrayLike<number>): ComplexBlock;
  finish(): ComplexBlock;
}

export function createOverlapSaveFilter(h: Float64Array, options: { decimation?: number; fftSize?: number } = {}): OverlapSaveFilter {
  const M = h.length;
  if (M < 1) throw new AnalysisInputError('the filter needs at least one tap');
  const D = options.decimation ?? 1;
  if (!Number.isInteger(D) || D < 1) throw new AnalysisInputError(`decimation must be an integer >= 1, got ${D}`);
  const P = options.fftSize ?? Math.max(4096, nextPowerOfTwo(4 * M));
  if (P < M || (P & (P - 1)) !== 0) throw new AnalysisInputError(`fftSize must be a power of two >= ${M}, got ${P}`);
  const fft = new FFT(P);
  const hHat = new Float64Array(2 * P);
  {
    const hc = new Float64Array(2 * P);
    for (let j = 0; j < M; j++) hc[2 * j] = h[j];
    fft.transform(hHat, hc);
  }
  const frame = new Float64Array(2 * P); // interleaved complex inputs
  const spec = new Float64Array(2 * P);
  const conv = new Float64Array(2 * P);
  let fill = 0; // complex samples in frame
  let outIndex = 0; // global index of the next valid output (before decimation)

  let outRe = new Float64Array(0);
  let outIm = new Float64Array(0);
  let cursor = 0;

  // filter frame[0..count) and append the valid outputs M−1..count−1 (every D-th) at `cursor`
  function runFrame(count: number): void {
    if (count < M) return;
    for (let i = 2 * count; i < 2 * P; i++) frame[i] = 0;
    fft.transform(spec, frame);
    for (let i = 0; i < 2 * P; i += 2) {
      const ar = spec[i];
      const ai = spec[i + 1];
      const br = hHat[i];
      const bi = hHat[i + 1];
      spec[i] = ar * br - ai * bi;
      spec[i + 1] = ar * bi + ai * br;
    }
    fft.inverseTransform(conv, spec);
    // circular wrap only spoils the first M−1 outputs of the frame
    for (let k = M - 1; k < count; k++) {
      if (outIndex % D === 0) {
        outRe[cursor] = conv[2 * k];
        outIm[cursor] = conv[2 * k + 1];
        cursor++;
      }
      outIndex++;
    }
  }

  function begin(inputs: number): void {
    // at most ⌈(fill + inputs)/D⌉ new outputs
    const bound = Math.ceil((fill + inputs) / D) + 1;
    outRe = new Float64Array(bound);
    outIm = new Float64Array(bound);
    cursor = 0;
  }

  function done(): ComplexBlock {
    return { re: outRe.slice(0, cursor), im: outIm.slice(0, cursor) };
  }

  return {
    taps: M,
    fftSize: P,
    push(re, im) {
      const n = re.length;
      begin(n);
      let i = 0;
      while (i < n) {
        const take = Math.min(P - fill, n - i);
        for (let j = 0; j < take; j++) {
          frame[2 * (fill + j)] = re[i + j];
          frame[2 * (fill + j) + 1] = im[i + j];
        }
        fill += take;
        i += take;
        if (fill === P) {
          runFrame(P);
          // keep the last M − 1 inputs as the history of the next frame
          frame.copyWithin(0, 2 * (P - (M - 1)), 2 * P);
          fill = M - 1;
        }
      }
      return done();
    },
    finish() {
      begin(0);
      if (fill >= M) runFrame(fill);
      fill = 0;
      return done();
    },
  };
}
