/**
 * Standard normal deviates by the Marsaglia polar method, on xoshiro128** uniforms.
 *
 * Usage:
 *   import { createGaussian } from '../analysis/synth/gaussian';
 *   const g = createGaussian(createRandom(7));
 *   g.fill(buffer, sigma);            // buffer[i] ~ N(0, σ²), written in place
 *   g.next();                         // one N(0, 1) deviate
 *
 * Method: draw (u, v) uniform on (−1, 1)² until s = u² + v² ∈ (0, 1); then u·√(−2 ln s / s) and
 * v·√(−2 ln s / s) are two independent N(0, 1) deviates (acceptance π/4).
 * Reference: G. Marsaglia, T. A. Bray, "A convenient method for generating normal variables",
 *   SIAM Review 6(3), 260-264 (1964).
 * Each uniform is one 32-bit output u32 mapped to (u32 + 0.5)·2⁻³¹ − 1 (never exactly ±1 or 0 in s's
 * sense), so |deviate| ≤ √(−2 ln 2⁻⁶⁴) ≈ 9.4: tails are exact well past anything a test can see.
 * fill() steps the generator's state in local variables (same sequence as Random.nextUint32).
 * Worked check: the mean of 10⁶ deviates is within 0.005 of 0 and the variance within 0.005 of 1.
 */

import type { Random } from './prng';

export interface Gaussian {
  next(): number;
  fill(out: Float64Array, sigma: number): void;
}

const INV_2_31 = 1 / 2147483648;

export function createGaussian(rng: Random): Gaussian {
  const state = rng.state;
  let spare = 0;
  let hasSpare = false;

  function fill(out: Float64Array, sigma: number): void {
    const n = out.length;
    let i = 0;
    if (n > 0 && hasSpare) {
      out[i++] = sigma * spare;
      hasSpare = false;
    }
    let s0 = state[0];
    let s1 = state[1];
    let s2 = state[2];
    let s3 = state[3];
    while (i < n) {
      let u: number;
      let v: number;
      let s: number;
      do {
        // two xoshiro128** steps (the body of Random.nextUint32, inlined)
        let m = Math.imul(s1, 5);
        const r1 = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
        let t = s1 << 9;
        s2 ^= s0;
        s3 ^= s1;
        s1 ^= s2;
        s0 ^= s3;
        s2 ^= t;
        s3 = (s3 << 11) | (s3 >>> 21);
        m = Math.imul(s1, 5);
        const r2 = Math.imul((m << 7) | (m >>> 25), 9) >>> 0;
        t = s1 << 9;
        s2 ^= s0;
        s3 ^= s1;
        s1 ^= s2;
        s0 ^= s3;
        s2 ^= t;
        s3 = (s3 << 11) | (s3 >>> 21);
        u = (r1 + 0.5) * INV_2_31 - 1;
        v = (r2 + 0.5) * INV_2_31 - 1;
        s = u * u + v * v;
      } while (s >= 1);
      const f = Math.sqrt((-2 * Math.log(s)) / s);
      const g2 = v * f;
      out[i++] = sigma * (u * f);
      // σ·(v·f) in both branches, so the values do not depend on where a block ends
      if (i < n) out[i++] = sigma * g2;
      else {
        spare = g2;
        hasSpare = true;
      }
    }
    state[0] = s0;
    state[1] = s1;
    state[2] = s2;
    state[3] = s3;
  }

  const one = new Float64Array(1);
  return {
    fill,
    next() {
      fill(one, 1);
      return one[0];
    },
  };
}
