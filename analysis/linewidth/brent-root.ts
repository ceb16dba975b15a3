/**
 * Root of a continuous function on a bracketing interval [a, b] (f(a)·f(b) <= 0) by Brent's method:
 * inverse quadratic interpolation / secant steps guarded by bisection.
 *
 * Usage:
 *   import { brentRoot } from './brent-root';
 *   brentRoot((x) => x * x - 2, 0, 2, 1e-14);   // 1.41421356237…
 *
 * Reference: R. P. Brent, "Algorithms for Minimization without Derivatives", Prentice-Hall (1973),
 * ch. 4 (procedure zero). Tolerance: |x − root| <= 4·eps·|x| + tol.
 * Worked check: x² − 2 on [0, 2] → √2 to 1e-14.
 */

import { AnalysisInputError } from '../errors';

export function brentRoot(fn: (x: number) => number, a: number, b: number, tol: number, maxIterations = 200): number {
  let fa = fn(a);
  let fb = fn(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) {
    throw new AnalysisInputError(`brentRoot: the interval [${a}, ${b}] does not bracket a root`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIterations; iter++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s; // secant
        q = 1 - s;
      } else {
        const qq = fa / fc; // inverse quadratic interpolation
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = fn(b);
  }
  return b;
}
