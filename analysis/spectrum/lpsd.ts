/**
 * LPSD: a Welch estimate per output frequency on a logarithmic axis, with a segment length chosen
 * for each frequency (resolution ∝ f, averages growing with f).
 *
 * Usage:
 *   import { planLpsd, lpsd } from '../analysis/spectrum/lpsd';
 *   const plan = planLpsd({ sampleRateHz: 1e6, samples: 2 ** 22, minHz: 1, maxHz: 5e5, points: 1000,
 *                           desiredAverages: 100, minAverages: 2, overlap: 0.5 });
 *   plan[300];          // { frequencyHz: 51.45…, segmentLength: 349407, hop, averages: 23, bin: … }
 *   lpsd(x, options);   // Spectrum (one-sided density); O(N·J): for records up to ~10⁶ samples
 *
 * Steps (equation numbers of the paper): f_j = f_min·e^{j·g/(J−1)}, g = ln(f_max/f_min) (12-13);
 * r'_j = f_j·(e^{g/(J−1)} − 1) (15); r_avg = (fs/N)(1 + (1−ξ)(K_des−1)), r_min = (fs/N)(1 + (1−ξ)(K_min−1))
 * (16-17); r''_j = r'_j if r'_j ≥ r_avg, else √(r_avg·r'_j) if that exceeds r_min, else r_min (18);
 * L_j = round(fs/r''_j), r_j = fs/L_j, m_j = f_j/r_j (19-20, 7); D_j = round((1−ξ)L_j) (rounding half
 * to even),
 * K_j = ⌊(N − L_j)/D_j + 1⌋; per segment remove the mean, apply the Hann window of length L_j,
 * evaluate the one DFT term at the fractional bin m_j, average |.|²; PSD = 2/(fs·S2_j)·average (28).
 * Reference: M. Tröbs, G. Heinzel, "Improved spectrum estimation from digitized time series on a
 *   logarithmic frequency axis", Measurement 39, 120-129 (2006), doi 10.1016/j.measurement.2005.10.010.
 * Worked check (METHODS 1.5): fs = 1 MHz, N = 2^22, 1 Hz…500 kHz, J = 1000, K_des = 100, K_min = 2,
 *   ξ = 0.5 → j = 0: L = 2506301, K = 2; j = 500: L = 93943, K = 88; j = 999: L = 151, K = 55187.
 * The streaming product path uses analysis/spectrum/log-frequency.ts instead (O(N log L)).
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

export interface LpsdOptions {
  sampleRateHz: number;
  /** record length N */
  samples: number;
  minHz: number;
  maxHz: number;
  /** number of output frequencies J */
  points: number;
  desiredAverages?: number;
  minAverages?: number;
  overlap?: number;
}

export interface LpsdFrequency {
  frequencyHz: number;
  segmentLength: number;
  hop: number;
  averages: number;
  /** fractional bin m_j = f_j·L_j/fs */
  bin: number;
  resolutionHz: number;
}

/** Round half to even (the rounding of the METHODS 1.5 check values, as numpy's round). */
function roundHalfEven(x: number): number {
  const r = Math.round(x);
  return Math.abs(x - Math.trunc(x)) === 0.5 && r % 2 !== 0 ? r - 1 : r;
}

export function planLpsd(options: LpsdOptions): LpsdFrequency[] {
  const { sampleRateHz: fs, samples: N, minHz, maxHz, points: J } = options;
  const Kdes = options.desiredAverages ?? 100;
  const Kmin = options.minAverages ?? 2;
  const xi = options.overlap ?? 0.5;
  if (!(fs > 0 && Number.isFinite(fs))) throw new AnalysisInputError(`sampleRateHz must be positive, got ${fs}`);
  if (!(Number.isInteger(N) && N >= 2)) throw new AnalysisInputError(`samples must be an integer >= 2, got ${N}`);
  if (!(minHz >= fs / N && maxHz <= fs / 2 && minHz < maxHz)) {
    throw new AnalysisInputError(`need fs/N <= minHz < maxHz <= fs/2, got minHz ${minHz}, maxHz ${maxHz}`);
  }
  if (!(Number.isInteger(J) && J >= 2)) throw new AnalysisInputError(`points must be an integer >= 2, got ${J}`);
  if (!(Kmin >= 1 && Kdes >= Kmin)) throw new AnalysisInputError(`need 1 <= minAverages <= desiredAverages, got ${Kmin}, ${Kdes}`);
  if (!(xi >= 0 && xi < 1)) throw new AnalysisInputError(`overlap must lie in [0, 1), got ${xi}`);
  const g = Math.log(maxHz / minHz);
  const rAvg = (fs / N) * (1 + (1 - xi) * (Kdes - 1)); // (16)
  const rMin = (fs / N) * (1 + (1 - xi) * (Kmin - 1)); // (17)
  const out: LpsdFrequency[] = [];
  for (let j = 0; j < J; j++) {
    const f = minHz * Math.exp((j * g) / (J - 1)); // (12-13)
    const rDesired = f * (Math.exp(g / (J - 1)) - 1); // (15)
    let r: number; // (18)
    if (rDesired >= rAvg) r = rDesired;
    else {
      const mid = Math.sqrt(rAvg * rDesired);
      r = mid > rMin ? mid : rMin;
    }
    const L = roundHalfEven(fs / r); // (19)
    const hop = Math.max(1, roundHalfEven((1 - xi) * L));
    const K = Math.floor((N - L) / hop + 1);
    out.push({ frequencyHz: f, segmentLength: L, hop, averages: K, bin: (f * L) / fs, resolutionHz: fs / L });
  }
  return out;
}

/** LPSD of x (one-sided density, Hann window, mean removed per segment). O(N·J). */
export function lpsd(x: ArrayLike<number>, options: Omit<LpsdOptions, 'samples'>): Spectrum {
  const plan = planLpsd({ ...options, samples: x.length });
  const fs = options.sampleRateHz;
  const frequencyHz = new Float64Array(plan.length);
  const psd = new Float64Array(plan.length);
  plan.forEach((p, j) => {
    const L = p.segmentLength;
    if (p.averages < 1 || L > x.length) {
      throw new AnalysisInputError(`frequency ${p.frequencyHz} Hz needs a segment of ${L} samples, longer than the record`);
    }
    let s2 = 0;
    const w = new Float64Array(L);
    for (let n = 0; n < L; n++) {
      w[n] = 0.5 - 0.5 * Math.cos((2 * Math.PI * n) / L); // periodic Hann
      s2 += w[n] * w[n];
    }
    const omega = (2 * Math.PI * p.bin) / L;
    let acc = 0;
    for (let k = 0; k < p.averages; k++) {
      const start = k * p.hop;
      let mean = 0;
      for (let n = 0; n < L; n++) mean += x[start + n];
      mean /= L;
      // the single DFT term at the fractional bin m_j
      let re = 0;
      let im = 0;
      for (let n = 0; n < L; n++) {
        const v = (x[start + n] - mean) * w[n];
        re += v * Math.cos(omega * n);
        im -= v * Math.sin(omega * n);
      }
      acc += re * re + im * im;
    }
    frequencyHz[j] = p.frequencyHz;
    psd[j] = (2 / (fs * s2)) * (acc / p.averages); // (28): PSD = 2/(fs·S2)·average
  });
  return { frequencyHz, psd };
}
