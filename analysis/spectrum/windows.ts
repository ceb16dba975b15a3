/**
 * Periodic ("DFT-even") data windows for spectral estimation, and their sums.
 *
 * Usage:
 *   import { makeWindow, windowSums } from '../analysis/spectrum/windows';
 *   const w = makeWindow('hann', 4096);
 *   const { s1, s2, nenbw } = windowSums(w);      // nenbw = L·Σw²/(Σw)² = 1.5000 bins
 *
 * Windows (z = 2πn/L, n = 0..L−1, periodic so that the DFT sees an exact cosine sum):
 *   hann             0.5 − 0.5·cos z
 *   blackman-harris  a0 − a1 cos z + a2 cos 2z − a3 cos 3z, a = 0.35875, 0.48829, 0.14128, 0.01168
 *                    (4-term, −92 dB side lobes; Harris 1978)
 *   flat-top         a0 − a1 cos z + a2 cos 2z − a3 cos 3z + a4 cos 4z,
 *                    a = 0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368
 *                    (the 5-term coefficients scipy.signal.windows.flattop uses; for reading line
 *                    amplitudes in 'spectrum' scaling, not for noise densities)
 * References: F. J. Harris, "On the use of windows for harmonic analysis with the discrete Fourier
 *   transform", Proc. IEEE 66(1), 51-83 (1978); G. Heinzel, A. Rüdiger, R. Schilling, "Spectrum and
 *   spectral density estimation by the Discrete Fourier transform (DFT), including a comprehensive
 *   list of window functions and some new flat-top windows", AEI Hannover report (2002).
 * Worked check (L = 4096): NENBW hann 1.5000, blackman-harris 2.0044, flat-top 3.7702 bins.
 */

import { AnalysisInputError } from '../errors';
import type { WindowName } from '../types';

export const WINDOW_NAMES: readonly WindowName[] = ['hann', 'blackman-harris', 'flat-top'];

/** Cosine-sum coefficients a_k of w = Σ (−1)^k a_k cos(k z). */
const COSINE_SUM_COEFFICIENTS: Record<WindowName, readonly number[]> = {
  hann: [0.5, 0.5],
  'blackman-harris': [0.35875, 0.48829, 0.14128, 0.01168],
  'flat-top': [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368],
};

export function isWindowName(name: unknown): name is WindowName {
  return typeof name === 'string' && (WINDOW_NAMES as readonly string[]).includes(name);
}

/** The periodic window of length L (a new array). */
export function makeWindow(name: WindowName, length: number): Float64Array {
  if (!isWindowName(name)) {
    throw new AnalysisInputError(`window must be one of ${WINDOW_NAMES.join(', ')}, got ${String(name)}`);
  }
  if (!Number.isInteger(length) || length < 1) {
    throw new AnalysisInputError(`window length must be an integer >= 1, got ${length}`);
  }
  const a = COSINE_SUM_COEFFICIENTS[name];
  const w = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    const z = (2 * Math.PI * n) / length; // periodic: divide by L, not L − 1
    let v = 0;
    for (let k = 0; k < a.length; k++) v += (k % 2 === 0 ? a[k] : -a[k]) * Math.cos(k * z);
    w[n] = v;
  }
  return w;
}

export interface WindowSums {
  /** Σ w[n] (coherent gain × L) */
  s1: number;
  /** Σ w[n]² */
  s2: number;
  /** normalised equivalent noise bandwidth L·S2/S1², bins */
  nenbw: number;
}

/** S1 = Σw, S2 = Σw², NENBW = L·S2/S1² (Heinzel 2002). ENBW in Hz is fs·S2/S1². */
export function windowSums(w: Float64Array): WindowSums {
  let s1 = 0;
  let s2 = 0;
  for (let n = 0; n < w.length; n++) {
    s1 += w[n];
    s2 += w[n] * w[n];
  }
  return { s1, s2, nenbw: (w.length * s2) / (s1 * s1) };
}
