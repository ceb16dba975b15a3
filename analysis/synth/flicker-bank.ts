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
  const poles = flickerPoles(options.sampleRateHz, options.level, options.lowestHz);
  const n = poles.length;
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  const state = new Float64Array(n);
  // one Gaussian stream per pole: the samples do not depend on how the record is cut into blocks
  const sources = poles.map((_, i) => gaussianForPole(i));
  for (let i = 0; i < n; i++) {
    a[i] = poles[i].a;
    b[i] = Math.sqrt(poles[i].variance * (1 - a[i] * a[i]));
    state[i] = Math.sqrt(poles[i].variance) * sources[i].next(); // stationary start
  }
  let e = new Float64Array(0);
  return {
    poles,
    add(out) {
      const count = out.length;
      if (e.length < count) e = new Float64Array(count);
      const ek = e.subarray(0, count);
      for (let i = 0; i < n; i++) {
        sources[i].fill(ek, b[i]);
        const ai = a[i];
        let x = state[i];
        for (let k = 0; k < count; k++) {
          x = ai * x + ek[k]; // x[k] = a·x[k−1] + √(V(1−a²))·e[k]
          out[k] += x;
        }
        state[i] = x;
      }
    },
  };
}
