/**
 * Flicker (1/f) noise as a sum of independent first-order relaxation processes spread over decades.
 *
 * Usage:
 *   import { createFlickerBank, flickerBankPsd } from '../analysis/synth/flicker-bank';
 *   const bank = createFlickerBank({ sampleRateHz: 1e6, level: 100, lowestHz: 0.1 }, gaussian);
 *   bank.add(nu);                            // adds the flicker part into nu (in place)
 *   flickerBankPsd(bank.poles, 1e6, 10);     // the generator's exact one-sided PSD at 10 Hz
 *
 * A relaxation (Ornstein-Uhlenbeck) process of variance V and time constant τ has the Lorentzian
 * one-sided PSD 4Vτ/(1 + (2πfτ)²). With τ_i spaced by the factor r = 10^{1/2} (two per decade) and
 * equal variances V = h·ln r, Σ_i 4Vτ_i/(1 + (2πfτ_i)²) ≈ (V/ln r)·∫ 4τ/(1+(2πfτ)²) dτ/τ = h/f.
 * (The superposition-of-relaxations picture of 1/f noise: M. S. Keshner, "1/f noise", Proc. IEEE
 * 70(3), 212-218 (1982); A. van der Ziel, "On the noise spectra of semi-conductor noise and of flicker
 * effect", Physica 16(4), 359-372 (1950).)
 * Discrete form: x[k] = a·x[k−1] + √(V(1−a²))·e[k], a = exp(−2π f_i/fs), started in its stationary
 * state (x[−1] ~ N(0, V)) so there is no transient; corner frequencies f_i = lowestHz·10^{(i−3)/2}
 * below fs/2 (starting 1.5 decades under lowestHz).
 * Accuracy of the exact discrete PSD (flickerBankPsd) against h/f, computed here with numpy: −1 %…+0.3 %
 * from lowestHz to fs/10 (±0.3 % from 3·lowestHz), +4 % at fs/4, +39 % at fs/2 (where the fastest
 * processes are no longer Lorentzian); below lowestHz it flattens (−11 % at lowestHz/10).
 * Speed: a pole with f_i < fs/8192 is stepped exactly (a^M, √(V(1 − a^{2M}))) only every
 * M = 2^p ≤ fs/(4096·f_i) samples and linearly interpolated in between. Where that pole matters
 * (f ≤ 30·f_i) the interpolation droop is < (π·30/4096)²/3 = 2e-4 of its share, and where the
 * interpolation is coarse (f ≳ 2048·f_i) its share of h/f is < 4e-4: the PSD stays within 1e-3 of
 * flickerBankPsd (which describes the all-full-rate bank). It roughly halves the work at fs ≥ 1 MHz.
 * Units: level h in Hz² (S = h/f in Hz²/Hz) when x is a frequency in Hz. Memory O(number of poles).
 */

import { AnalysisInputError } from '../errors';
import type { Gaussian } from './gaussian';

export interface FlickerPole {
  /** corner frequency f_i = 1/(2πτ_i), Hz */
  cornerHz: number;
  /** a = exp(−2π f_i/fs) */
  a: number;
  /** stationary variance V */
  variance: number;
}

export interface FlickerBank {
  readonly poles: readonly FlickerPole[];
  /** add the next values of the flicker process into out (in place) */
  add(out: Float64Array): void;
}

export const FLICKER_POLES_PER_DECADE = 2;
/** A pole whose corner f_i lies below fs/(2·4096) is stepped every M = 2^p ≤ fs/(4096·f_i) samples. */
export const MULTIRATE_FACTOR = 4096;

export function flickerPoles(sampleRateHz: number, level: number, lowestHz: number): FlickerPole[] {
  if (!(lowestHz > 0 && lowestHz < sampleRateHz / 2)) {
    throw new AnalysisInputError(`the lowest flicker frequency must lie in (0, fs/2), got ${lowestHz} Hz`);
  }
  const r = 10 ** (1 / FLICKER_POLES_PER_DECADE);
  const V = level * Math.log(r); // equal variances h·ln r
  const poles: FlickerPole[] = [];
  for (let f = lowestHz / (r * r * r); f < sampleRateHz / 2; f *= r) {
    poles.push({ cornerHz: f, a: Math.exp((-2 * Math.PI * f) / sampleRateHz), variance: V });
  }
  return poles;
}

/** Exact one-sided PSD of the discrete bank: Σ_i 2V(1−a²)/(fs·(1 − 2a·cos ω + a²)), ω = 2πf/fs. */
export function flickerBankPsd(poles: readonly FlickerPole[], sampleRateHz: number, frequencyHz: number): number {
  const c = Math.cos((2 * Math.PI * frequencyHz) / sampleRateHz);
  let s = 0;
  for (const p of poles) s += (2 * p.variance * (1 - p.a * p.a)) / (sampleRateHz * (1 - 2 * p.a * c + p.a * p.a));
  return s;
}

export function createFlickerBank(
  options: { sampleRateHz: number; level: number; lowestHz: number },
  gaussianForPole: (pole: number) => Gaussian,
): FlickerBank {
  const fs = options.sampleRateHz;
  const poles = flickerPoles(fs, options.level, options.lowestHz);
  const n = poles.length;
  // one Gaussian stream per pole: the samples do not depend on how the record is cut into blocks
  const sources = poles.map((_, i) => gaussianForPole(i));
  const step = new Int32Array(n); // M_i: the pole is stepped every M_i samples (power of two)
  const a = new Float64Array(n); // a^M
  const b = new Float64Array(n); // √(V(1 − a^{2M}))
  const prev = new Float64Array(n); // x at the last step (M = 1: the last sample)
  const next = new Float64Array(n); // x at the coming step (M > 1)
  const phase = new Int32Array(n); // samples since the last step (M > 1)
  for (let i = 0; i < n; i++) {
    let M = 1;
    while (M * 2 <= fs / (MULTIRATE_FACTOR * poles[i].cornerHz)) M *= 2;
    step[i] = M;
    a[i] = poles[i].a ** M;
    b[i] = Math.sqrt(poles[i].variance * (1 - a[i] * a[i]));
    prev[i] = Math.sqrt(poles[i].variance) * sources[i].next(); // stationary start
    if (M > 1) next[i] = a[i] * prev[i] + b[i] * sources[i].next();
  }
  let e = new Float64Array(0);
  return {
    poles,
    add(out) {
      const count = out.length;
      if (e.length < count) e = new Float64Array(count);
      const ek = e.subarray(0, count);
      for (let i = 0; i < n; i++) {
        const M = step[i];
        const ai = a[i];
        if (M === 1) {
          sources[i].fill(ek, b[i]);
          let x = prev[i];
          for (let k = 0; k < count; k++) {
            x = ai * x + ek[k]; // x[k] = a·x[k−1] + √(V(1−a²))·e[k]
            out[k] += x;
          }
          prev[i] = x;
          continue;
        }
        // slow pole: exact steps x_{j+1} = a^M·x_j + √(V(1−a^{2M}))·e every M samples, linear in between
        let x0 = prev[i];
        let x1 = next[i];
        let r = phase[i];
        let k = 0;
        while (k < count) {
          const run = Math.min(M - r, count - k);
          const slope = (x1 - x0) / M;
          // x0 + slope·(position in the step): the same value wherever a block happens to start
          for (let j = 0; j < run; j++) out[k + j] += x0 + slope * (r + j);
          k += run;
          r += run;
          if (r === M) {
            x0 = x1;
            x1 = ai * x0 + b[i] * sources[i].next();
            r = 0;
          }
        }
        prev[i] = x0;
        next[i] = x1;
        phase[i] = r;
      }
    },
  };
}
