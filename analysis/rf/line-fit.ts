/**
 * Least-squares fits of a Lorentzian, Gaussian or Voigt line on a constant baseline to an RF beat
 * spectrum in linear power, with each FWHM's standard uncertainty and the residual.
 *
 * Usage:
 *   import { fitRfLine, fitRfLines } from '../analysis/rf/line-fit';
 *   const fit = fitRfLine(spectrum, 'voigt');                 // spectrum: { frequencyHz, powerMw }
 *   fit.fwhmHz; fit.fwhmUncertaintyHz; fit.lorentzianFwhmHz; fit.residualRmsMw
 *   const all = fitRfLines(spectrum, { bandHz: [79e6, 81e6] }); // the three shapes; all.bestShape
 *
 * Models (Phaseloom METHODS 4.4; shapes in analysis/rf/line-shapes.ts), linear power P [mW] against f [Hz]:
 *   P(f) = B + A·shape(f − f0; widths) — A the height above the baseline B; Lorentzian and Gaussian by
 *   their FWHM w, Voigt by its Lorentzian and Gaussian FWHMs f_L, f_G. Fitting linear power, not dB
 *   (dB fits overweight the wings).
 * Method: Levenberg–Marquardt (ml-levenberg-marquardt; K. Levenberg, Q. Appl. Math. 2, 164 (1944);
 *   D. W. Marquardt, J. SIAM 11, 431 (1963)) with analytic Jacobians, on scaled variables
 *   (u = (f − f_c)/s, y = P/P_max; s the starting FWHM) so every parameter is of order 1. It runs in
 *   rounds of 25 iterations until the Gauss–Newton step left at the solution is below 1e-4 standard
 *   errors (or 1e-10 of the parameter, or 1e-12 in scaled units) for every parameter; otherwise the fit has not converged.
 *   Voigt derivatives from w′(z) = −2z·w(z) + 2i/√π.
 * Uncertainties: covariance s²(JᵀJ)⁻¹ with s² = Σ r²/(n − p) (unweighted least squares with the scatter
 *   estimated from the residuals; scipy.optimize.curve_fit's absolute_sigma=False). The Voigt FWHM is
 *   reported by Olivero & Longbothum (analysis/rf/voigt-width.ts), its uncertainty propagated through
 *   the formula's gradient; the exact FWHM is given beside it.
 * Starting point (unless given): B = 10th percentile of P; f0 at the maximum; A = P_max − B; w from the
 *   half-maximum crossings nearest the peak; Voigt f_L = f_G = w/1.6376.
 * Failure: a flat spectrum (no line), a parameter running to its limit (centre leaving the band, a
 *   width wider than 10 spans or narrower than 1e-4 of the start, height to 0), a singular JᵀJ, no
 *   convergence, or a fitted height below 3 standard errors (no line) → AnalysisInputError naming what happened. A Voigt fit whose Gaussian (Lorentzian)
 *   part goes to 0 is reported as the Lorentzian (Gaussian) fit, with a warning.
 * Defaults: the whole spectrum; at most 400 iterations; bestShape = smallest residual, preferring the
 *   simpler shape unless the Voigt residual is lower by more than 1 %.
 * Worked check: P = 1e-5 + 2e-3·L(f − 80.02 MHz; 150 kHz) → w = 150 kHz (to 1e-6 without noise).
 */

import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { CholeskyDecomposition, Matrix } from 'ml-matrix';

import { AnalysisInputError } from '../errors';
import { faddeeva, type Complex } from './faddeeva';
import { GAUSSIAN_FWHM_PER_SIGMA } from './line-shapes';
import type { RfSpectrum } from './spectrum-csv';
import { voigtFwhmExact, voigtFwhmOliveroLongbothum, voigtFwhmOliveroLongbothumGradient } from './voigt-width';

export type RfLineShape = 'lorentzian' | 'gaussian' | 'voigt';
export const RF_LINE_SHAPES: readonly RfLineShape[] = ['lorentzian', 'gaussian', 'voigt'];

export interface RfLineStart {
  centerHz?: number;
  /** Lorentzian/Gaussian FWHM; for a Voigt, the start of both parts when they are not given */
  fwhmHz?: number;
  lorentzianFwhmHz?: number;
  gaussianFwhmHz?: number;
  peakMw?: number;
  baselineMw?: number;
}

export interface RfLineFitOptions {
  /** fit only the points with f in [lo, hi], Hz */
  bandHz?: [number, number];
  /** starting values (any subset); the rest are estimated from the data */
  initial?: RfLineStart;
  maxIterations?: number;
  /** resolution bandwidth of the analyser, Hz: a warning when it is not ≪ the fitted width */
  resolutionBandwidthHz?: number;
}

export interface RfLineFit {
  shape: RfLineShape;
  centerHz: number;
  centerUncertaintyHz: number;
  /** height above the baseline, mW */
  peakMw: number;
  peakUncertaintyMw: number;
  baselineMw: number;
  baselineUncertaintyMw: number;
  /** FWHM of the line; for a Voigt the Olivero–Longbothum value */
  fwhmHz: number;
  fwhmUncertaintyHz: number;
  /** Voigt only: the exact FWHM of the fitted profile */
  exactFwhmHz: number | null;
  /** Voigt: its parts (Lorentzian fit: lorentzian = fwhm; Gaussian fit: gaussian = fwhm) */
  lorentzianFwhmHz: number | null;
  lorentzianFwhmUncertaintyHz: number | null;
  gaussianFwhmHz: number | null;
  gaussianFwhmUncertaintyHz: number | null;
  /** √(Σ r²/n), mW */
  residualRmsMw: number;
  /** residualRmsMw / peakMw */
  residualRelative: number;
  points: number;
  iterations: number;
  /** the fitted model on the fitted points, mW */
  modelMw: Float64Array;
  frequencyHz: Float64Array;
  warnings: string[];
}

export interface RfLineFits {
  fits: RfLineFit[];
  bestShape: RfLineShape;
  warnings: string[];
}

interface Resolved {
  f: Float64Array;
  p: Float64Array;
  start: Required<Omit<RfLineStart, 'lorentzianFwhmHz' | 'gaussianFwhmHz'>> & { lorentzianFwhmHz: number; gaussianFwhmHz: number };
  maxIterations: number;
  rbwHz: number | null;
}

const MIN_POINTS = 8;
const ROUND = 25;
const LN2 = Math.LN2;
const TWO_OVER_SQRT_PI = 2 / Math.sqrt(Math.PI);
const SQRT_2PI = Math.sqrt(2 * Math.PI);

function fail(message: string): never {
  throw new AnalysisInputError(`the ${message}`);
}

function resolve(spectrum: RfSpectrum, options: RfLineFitOptions): Resolved {
  if (!spectrum || !(spectrum.frequencyHz instanceof Float64Array) || !(spectrum.powerMw instanceof Float64Array)) {
    throw new AnalysisInputError('the spectrum must hold frequencyHz and powerMw as Float64Arrays');
  }
  const F = spectrum.frequencyHz;
  const P = spectrum.powerMw;
  if (F.length !== P.length) throw new AnalysisInputError(`frequencyHz and powerMw differ in length (${F.length} vs ${P.length})`);
  const o = options ?? {};
  let lo = -Infinity;
  let hi = Infinity;
  if (o.bandHz !== undefined) {
    if (!Array.isArray(o.bandHz) || o.bandHz.length !== 2 || !(o.bandHz[0] < o.bandHz[1])) {
      throw new AnalysisInputError(`bandHz must be [lo, hi] with lo < hi, got ${JSON.stringify(o.bandHz)}`);
    }
    [lo, hi] = o.bandHz;
  }
  const fs: number[] = [];
  const ps: number[] = [];
  for (let i = 0; i < F.length; i++) {
    if (!Number.isFinite(F[i]) || !Number.isFinite(P[i])) throw new AnalysisInputError('values must be finite', `point ${i}`);
    if (i > 0 && !(F[i] > F[i - 1])) throw new AnalysisInputError('frequencies must increase strictly', `point ${i}`);
    if (F[i] >= lo && F[i] <= hi) {
      fs.push(F[i]);
      ps.push(P[i]);
    }
  }
  if (fs.length < MIN_POINTS) throw new AnalysisInputError(`a line fit needs at least ${MIN_POINTS} points in the band, got ${fs.length}`);
  const f = Float64Array.from(fs);
  const p = Float64Array.from(ps);
  const maxIterations = o.maxIterations ?? 400;
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1)) {
    throw new AnalysisInputError(`maxIterations must be an integer >= 1, got ${String(o.maxIterations)}`);
  }
  const rbw = o.resolutionBandwidthHz ?? null;
  if (rbw !== null && !(rbw > 0 && Number.isFinite(rbw))) throw new AnalysisInputError(`resolutionBandwidthHz must be > 0, got ${rbw}`);

  // starting point from the data
  const sorted = Float64Array.from(p).sort();
  const baseline0 = sorted[Math.floor(0.1 * (sorted.length - 1))];
  let k = 0;
  for (let i = 1; i < p.length; i++) if (p[i] > p[k]) k = i;
  const peak0 = p[k] - baseline0;
  if (!(peak0 > 0) || peak0 <= 1e-12 * Math.abs(p[k])) fail('spectrum is flat: there is no line to fit');
  const halfLevel = baseline0 + peak0 / 2;
  const crossing = (dir: 1 | -1): number | null => {
    for (let i = k; i + dir >= 0 && i + dir < p.length; i += dir) {
      if (p[i + dir] <= halfLevel) {
        const t = (p[i] - halfLevel) / (p[i] - p[i + dir]);
        return f[i] + t * (f[i + dir] - f[i]);
      }
    }
    return null;
  };
  const left = crossing(-1);
  const right = crossing(1);
  const span = f[f.length - 1] - f[0];
  let w0 = left !== null && right !== null ? right - left : left !== null ? 2 * (f[k] - left) : right !== null ? 2 * (right - f[k]) : span / 4;
  if (!(w0 > 0)) w0 = Math.max(span / f.length, span / 100);
  const s = o.initial ?? {};
  const pick = (v: number | undefined, fallback: number, name: string, positive: boolean) => {
    if (v === undefined) return fallback;
    if (!Number.isFinite(v) || (positive && !(v > 0))) throw new AnalysisInputError(`initial.${name} must be a ${positive ? 'positive ' : ''}finite number, got ${v}`);
    return v;
  };
  const fwhm = pick(s.fwhmHz, w0, 'fwhmHz', true);
  const start = {
    centerHz: pick(s.centerHz, f[k], 'centerHz', false),
    fwhmHz: fwhm,
    lorentzianFwhmHz: pick(s.lorentzianFwhmHz, fwhm / 1.6376, 'lorentzianFwhmHz', true),
    gaussianFwhmHz: pick(s.gaussianFwhmHz, fwhm / 1.6376, 'gaussianFwhmHz', true),
    peakMw: pick(s.peakMw, peak0, 'peakMw', true),
    baselineMw: pick(s.baselineMw, baseline0, 'baselineMw', false),
  };
  return { f, p, start, maxIterations, rbwHz: rbw };
}

// ---- scaled models and their Jacobians: parameters [A, u0, w, B] or [A, u0, wL, wG, B] ----

type Model = (q: number[]) => (u: number) => number;
type Jacobian = (q: number[]) => (u: number) => number[];

const lorentzModel: Model = ([a, u0, w, b]) => {
  const h2 = (w * w) / 4;
  return (u) => b + (a * h2) / ((u - u0) * (u - u0) + h2);
};
const lorentzJacobian: Jacobian = ([a, u0, w]) => {
  const h = w / 2;
  const h2 = h * h;
  return (u) => {
    const d = u - u0;
    const den = d * d + h2;
    const l = h2 / den;
    // ∂L/∂u0 = 2d h²/den², ∂L/∂w = ½ ∂L/∂h = h d²/den²
    return [l, (a * 2 * d * h2) / (den * den), (a * h * d * d) / (den * den), 1];
  };
};
const gaussModel: Model = ([a, u0, w, b]) => (u) => b + a * Math.exp((-4 * LN2 * (u - u0) * (u - u0)) / (w * w));
const gaussJacobian: Jacobian = ([a, u0, w]) => (u) => {
  const d = u - u0;
  const g = Math.exp((-4 * LN2 * d * d) / (w * w));
  // ∂G/∂u0 = G·8ln2·d/w², ∂G/∂w = G·8ln2·d²/w³
  return [g, (a * g * 8 * LN2 * d) / (w * w), (a * g * 8 * LN2 * d * d) / (w * w * w), 1];
};

/** Voigt u(d; σ, γ) = Re w(z)/(σ√2π), z = (d + iγ)/(σ√2), and ∂u/∂d, ∂u/∂γ, ∂u/∂σ, written into out[0..3]. */
function voigtWithDerivatives(d: number, sigma: number, gamma: number, w: Complex, out: Float64Array): void {
  const s = sigma * Math.SQRT2;
  const zr = d / s;
  const zi = gamma / s;
  faddeeva(zr, zi, w);
  // w′ = −2 z w + 2i/√π
  const dr = -2 * (zr * w.re - zi * w.im);
  const di = -2 * (zr * w.im + zi * w.re) + TWO_OVER_SQRT_PI;
  const norm = 1 / (sigma * SQRT_2PI);
  const u = w.re * norm;
  out[0] = u;
  out[1] = (dr / s) * norm; // ∂z/∂d = 1/s
  out[2] = (-di / s) * norm; // ∂z/∂γ = i/s: Re(i w′) = −Im w′
  // ∂z/∂σ = −z/σ: Re(w′·(−z))/σ·norm − u/σ
  out[3] = (-(dr * zr - di * zi) / sigma) * norm - u / sigma;
}

function voigtModels(): { model: Model; jacobian: Jacobian } {
  const w: Complex = { re: 0, im: 0 };
  const at = new Float64Array(4);
  const centre = new Float64Array(4);
  const model: Model = ([a, u0, wl, wg, b]) => {
    const gamma = wl / 2;
    const sigma = wg / GAUSSIAN_FWHM_PER_SIGMA;
    voigtWithDerivatives(0, sigma, gamma, w, centre);
    const u0v = centre[0];
    return (u) => {
      voigtWithDerivatives(u - u0, sigma, gamma, w, at);
      return b + (a * at[0]) / u0v;
    };
  };
  const jacobian: Jacobian = ([a, u0, wl, wg]) => {
    const gamma = wl / 2;
    const sigma = wg / GAUSSIAN_FWHM_PER_SIGMA;
    voigtWithDerivatives(0, sigma, gamma, w, centre);
    const c0 = centre[0];
    const c2 = centre[2];
    const c3 = centre[3];
    return (u) => {
      voigtWithDerivatives(u - u0, sigma, gamma, w, at);
      const v = at[0] / c0;
      // ∂(u/u0)/∂p = (∂u/∂p − v·∂u0/∂p)/u0; γ = wL/2, σ = wG/(2√(2ln2))
      const dGamma = (at[2] - v * c2) / c0;
      const dSigma = (at[3] - v * c3) / c0;
      return [v, (-a * at[1]) / c0, (a * dGamma) / 2, (a * dSigma) / GAUSSIAN_FWHM_PER_SIGMA, 1];
    };
  };
  return { model, jacobian };
}

interface Solved {
  q: number[];
  covariance: Matrix;
  sse: number;
  iterations: number;
}

/** JᵀJ, Jᵀr and Σr² at q. */
function normalEquations(u: Float64Array, y: Float64Array, q: number[], model: Model, jacobian: Jacobian) {
  const n = q.length;
  const jtj = Matrix.zeros(n, n);
  const jtr = Matrix.zeros(n, 1);
  const fn = model(q);
  const jac = jacobian(q);
  let sse = 0;
  for (let i = 0; i < u.length; i++) {
    const r = y[i] - fn(u[i]);
    sse += r * r;
    const g = jac(u[i]);
    for (let a = 0; a < n; a++) {
      jtr.set(a, 0, jtr.get(a, 0) + g[a] * r);
      for (let b = 0; b <= a; b++) jtj.set(a, b, jtj.get(a, b) + g[a] * g[b]);
    }
  }
  for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) jtj.set(a, b, jtj.get(b, a));
  return { jtj, jtr, sse };
}

function solveScaled(
  u: Float64Array,
  y: Float64Array,
  start: number[],
  model: Model,
  jacobian: Jacobian,
  min: number[],
  max: number[],
  maxIterations: number,
  names: string[],
): Solved {
  let q = start.slice();
  let iterations = 0;
  for (;;) {
    const round = Math.min(ROUND, maxIterations - iterations);
    const r = levenbergMarquardt({ x: u, y }, model, {
      initialValues: q,
      jacobianFunction: jacobian,
      minValues: min,
      maxValues: max,
      maxIterations: round,
      errorTolerance: 0,
      damping: 1e-3,
    });
    iterations += round;
    q = r.parameterValues;
    if (!q.every(Number.isFinite)) fail('fit did not converge: a parameter became non-finite');
    const { jtj, jtr, sse } = normalEquations(u, y, q, model, jacobian);
    const chol = new CholeskyDecomposition(jtj);
    if (!chol.isPositiveDefinite()) fail('fit did not converge: the normal matrix is singular (the line is not resolved by the data)');
    const step = chol.solve(jtr);
    const inv = chol.solve(Matrix.eye(q.length));
    const s2 = sse / Math.max(1, u.length - q.length);
    let converged = true;
    for (let k = 0; k < q.length; k++) {
      const se = Math.sqrt(Math.max(0, s2 * inv.get(k, k)));
      if (Math.abs(step.get(k, 0)) > Math.max(1e-4 * se, 1e-10 * Math.abs(q[k]), 1e-12)) converged = false;
    }
    if (converged) {
      for (let k = 0; k < q.length; k++) {
        const atMin = q[k] <= min[k] * (1 + 1e-9) + 1e-15 && min[k] > -Infinity;
        const atMax = q[k] >= max[k] * (1 - 1e-9);
        if (atMin || atMax) fail(`fit did not converge: ${names[k]} ran to its limit (${atMin ? 'lower' : 'upper'})`);
      }
      return { q, covariance: inv.mul(s2), sse, iterations };
    }
    if (iterations >= maxIterations) {
      // a Voigt whose one part keeps shrinking toward 0 (a pure line of the other shape) creeps there
      // without settling: say so, so the caller reports the pure shape
      const k = vanishingVoigtPart(q, names);
      if (k !== null) fail(`fit did not converge: ${names[k]} ran to its limit (lower) — below 1 % of the other part after ${maxIterations} iterations`);
      fail(`fit did not converge within ${maxIterations} iterations (the Gauss–Newton step is still larger than 1e-4 standard errors)`);
    }
  }
}

/** For a Voigt parameter vector [A, centre, f_L, f_G, B]: the index of a width part below 1 % of the other, or null. */
function vanishingVoigtPart(q: number[], names: string[]): number | null {
  if (names[2] !== 'the Lorentzian width' || names[3] !== 'the Gaussian width') return null;
  if (q[2] < 0.01 * q[3]) return 2;
  if (q[3] < 0.01 * q[2]) return 3;
  return null;
}

function fitShape(r: Resolved, shape: RfLineShape): RfLineFit {
  const { f, p, start } = r;
  const fc = start.centerHz;
  const scale = start.fwhmHz; // s
  const pn = start.peakMw + Math.max(0, start.baselineMw); // y = P/P_n
  const u = new Float64Array(f.length);
  const y = new Float64Array(f.length);
  for (let i = 0; i < f.length; i++) {
    u[i] = (f[i] - fc) / scale;
    y[i] = p[i] / pn;
  }
  const uLo = u[0];
  const uHi = u[u.length - 1];
  const spanU = uHi - uLo;
  const minW = 1e-4;
  const maxW = 10 * spanU;
  const a0 = start.peakMw / pn;
  const b0 = start.baselineMw / pn;
  const bLim = 10 * Math.max(1, Math.abs(b0));
  const warnings: string[] = [];
  let q: number[];
  let solved: Solved;
  let names: string[];
  if (shape === 'voigt') {
    const { model, jacobian } = voigtModels();
    names = ['the height', 'the centre', 'the Lorentzian width', 'the Gaussian width', 'the baseline'];
    const wl = start.lorentzianFwhmHz / scale;
    const wg = start.gaussianFwhmHz / scale;
    try {
      solved = solveScaled(u, y, [a0, 0, wl, wg, b0], model, jacobian, [1e-12, uLo, minW, minW, -bLim], [1e3, uHi, maxW, maxW, bLim], r.maxIterations, names);
    } catch (e) {
      const m = e instanceof AnalysisInputError ? /the (Lorentzian|Gaussian) width ran to its limit \(lower\)/.exec(e.message) : null;
      if (!m) throw e;
      // one part vanished: the line is the other pure shape
      const other: RfLineShape = m[1] === 'Lorentzian' ? 'gaussian' : 'lorentzian';
      const pure = fitShape(r, other);
      return {
        ...pure,
        shape: 'voigt',
        exactFwhmHz: pure.fwhmHz,
        lorentzianFwhmHz: other === 'lorentzian' ? pure.fwhmHz : 0,
        lorentzianFwhmUncertaintyHz: other === 'lorentzian' ? pure.fwhmUncertaintyHz : null,
        gaussianFwhmHz: other === 'gaussian' ? pure.fwhmHz : 0,
        gaussianFwhmUncertaintyHz: other === 'gaussian' ? pure.fwhmUncertaintyHz : null,
        warnings: [...pure.warnings, `the Voigt fit's ${m[1]} part went to 0: the line is ${other === 'lorentzian' ? 'Lorentzian' : 'Gaussian'}, reported as such`],
      };
    }
    q = solved.q;
  } else {
    names = ['the height', 'the centre', 'the width', 'the baseline'];
    const [model, jacobian] = shape === 'lorentzian' ? [lorentzModel, lorentzJacobian] : [gaussModel, gaussJacobian];
    solved = solveScaled(u, y, [a0, 0, 1, b0], model, jacobian, [1e-12, uLo, minW, -bLim], [1e3, uHi, maxW, bLim], r.maxIterations, names);
    q = solved.q;
  }
  const cov = solved.covariance;
  const se = (k: number) => Math.sqrt(Math.max(0, cov.get(k, k)));
  const nb = q.length - 1;
  const modelFn = shape === 'voigt' ? voigtModels().model(q) : shape === 'lorentzian' ? lorentzModel(q) : gaussModel(q);
  const modelMw = new Float64Array(f.length);
  for (let i = 0; i < f.length; i++) modelMw[i] = modelFn(u[i]) * pn;
  const residualRmsMw = Math.sqrt(solved.sse / f.length) * pn;
  const peakMw = q[0] * pn;
  let fwhmHz: number;
  let fwhmSe: number;
  let lor: number | null = null;
  let lorSe: number | null = null;
  let gau: number | null = null;
  let gauSe: number | null = null;
  let exact: number | null = null;
  if (shape === 'voigt') {
    lor = q[2] * scale;
    gau = q[3] * scale;
    lorSe = se(2) * scale;
    gauSe = se(3) * scale;
    fwhmHz = voigtFwhmOliveroLongbothum(lor, gau);
    const [gl, gg] = voigtFwhmOliveroLongbothumGradient(lor, gau);
    // var f_V = gᵀ C g over (f_L, f_G)
    const c = (a: number, b: number) => cov.get(a, b) * scale * scale;
    fwhmSe = Math.sqrt(Math.max(0, gl * gl * c(2, 2) + 2 * gl * gg * c(2, 3) + gg * gg * c(3, 3)));
    exact = voigtFwhmExact(lor, gau);
  } else {
    fwhmHz = q[2] * scale;
    fwhmSe = se(2) * scale;
    if (shape === 'lorentzian') {
      lor = fwhmHz;
      lorSe = fwhmSe;
    } else {
      gau = fwhmHz;
      gauSe = fwhmSe;
    }
  }
  if (!(peakMw > 3 * se(0) * pn)) {
    fail(`fit found no line standing out of the noise: height ${peakMw.toPrecision(3)} ± ${(se(0) * pn).toPrecision(3)} mW (less than 3 standard errors)`);
  }
  if (r.rbwHz !== null && r.rbwHz > fwhmHz / 10) {
    warnings.push(`the resolution bandwidth (${r.rbwHz} Hz) is not ≪ the fitted width (${fwhmHz.toPrecision(4)} Hz): the width includes the analyser's filter`);
  }
  const spacing = (f[f.length - 1] - f[0]) / (f.length - 1);
  if (fwhmHz < 3 * spacing) warnings.push(`the fitted width spans fewer than 3 frequency points (spacing ${spacing.toPrecision(3)} Hz): it is poorly resolved`);
  return {
    shape,
    centerHz: fc + q[1] * scale,
    centerUncertaintyHz: se(1) * scale,
    peakMw,
    peakUncertaintyMw: se(0) * pn,
    baselineMw: q[nb] * pn,
    baselineUncertaintyMw: se(nb) * pn,
    fwhmHz,
    fwhmUncertaintyHz: fwhmSe,
    exactFwhmHz: exact,
    lorentzianFwhmHz: lor,
    lorentzianFwhmUncertaintyHz: lorSe,
    gaussianFwhmHz: gau,
    gaussianFwhmUncertaintyHz: gauSe,
    residualRmsMw,
    residualRelative: residualRmsMw / peakMw,
    points: f.length,
    iterations: solved.iterations,
    modelMw,
    frequencyHz: f,
    warnings,
  };
}

/** Fits one line shape; see the header. */
export function fitRfLine(spectrum: RfSpectrum, shape: RfLineShape, options: RfLineFitOptions = {}): RfLineFit {
  if (!RF_LINE_SHAPES.includes(shape)) throw new AnalysisInputError(`shape must be one of ${RF_LINE_SHAPES.join(', ')}, got ${String(shape)}`);
  return fitShape(resolve(spectrum, options), shape);
}

/** Fits the three shapes and names the one that describes the data best. */
export function fitRfLines(spectrum: RfSpectrum, options: RfLineFitOptions = {}): RfLineFits {
  const r = resolve(spectrum, options);
  const fits = RF_LINE_SHAPES.map((shape) => fitShape(r, shape));
  const [lor, gau, voi] = fits;
  let best: RfLineShape = lor.residualRmsMw <= gau.residualRmsMw ? 'lorentzian' : 'gaussian';
  const bestSimple = Math.min(lor.residualRmsMw, gau.residualRmsMw);
  if (voi.residualRmsMw < 0.99 * bestSimple) best = 'voigt';
  return { fits, bestShape: best, warnings: fits.flatMap((x) => x.warnings.map((w) => `${x.shape}: ${w}`)) };
}
