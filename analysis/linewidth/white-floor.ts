/**
 * White frequency-noise floor S_ν,white and the intrinsic (Lorentzian) linewidth π·S_ν,white.
 *
 * Usage:
 *   import { whiteFloor } from '../analysis/linewidth/white-floor';
 *   const auto = whiteFloor(logSpectrum);                              // flattest low band, found automatically
 *   const given = whiteFloor(logSpectrum, { bandHz: [1e4, 1e5] });     // mean of linear S_ν over a band
 *   auto.valueHz2PerHz; auto.intrinsicLinewidthHz; auto.bandHz; auto.warnings
 *
 * Physics: white frequency noise S_ν = h0 (one-sided, Hz²/Hz) gives Γ(τ) = exp(−π²h0|τ|), a Lorentzian
 * line of FWHM Δν = π·h0 (Elliott, Roy, Smith, Phys. Rev. A 26, 12 (1982); Phaseloom METHODS 3.2).
 * Floor over a given band: the mean of the linear S_ν values of the grid points in [lo, hi] (never a
 * mean of dB values, which is biased low: METHODS 3.2).
 * Automatic band (our own search rule, stated here):
 *  1. Search range: minHz (default 4 × the lowest positive grid frequency — Welch bins m < 4 are
 *     biased by leakage, METHODS 1.4) to maxHz (default top/5, i.e. fs/10 for a spectrum reaching
 *     Nyquist — METHODS 2.4: below fs/10 the finite-difference and aliasing effects stay under 3.4 %).
 *     Points next to given spurs, and points more than 10× their log bin's median, are left out.
 *  2. The points are gathered into log bins of 1/20 decade (mean of linear S_ν in each bin).
 *  3. A window of `windowDecades` (default ½ decade) slides over the bins; in each, log10 S is fitted
 *     by a parabola in log10 f (weights = points per bin) and the log-log slope is read at both window
 *     edges, with its standard error from the scatter of the points inside the bins (Welch scatter).
 *  4. A window is "white-dominated" when both edge slopes are within 0.25 (less 2 standard errors):
 *     for S = h0 + X with X ∝ f^k the local slope is k·X/S, and |slope| < 0.25 with |k| = 1 is
 *     METHODS 3.2's h0 > 3·X.
 *  5. Among white-dominated windows the lowest-level ones win (mean S within 0.3 % + 2 standard errors
 *     of the lowest: white noise is the floor under bumps, spurs and the f² detection rise); the
 *     flattest of them, grown over the contiguous near-lowest white-dominated windows around it, is
 *     the band. If no window qualifies, the flattest window is used and a warning says so; a band
 *     still leaning by more than 0.1 in log-log slope is reported with a warning (flicker adds ≈ |slope|).
 * Worked check: S_ν = 10⁴ Hz²/Hz everywhere → floor 10⁴, intrinsic linewidth 31415.93 Hz.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum, Spur, WhiteFloorResult } from '../types';
import { checkSpectrum } from './spectrum-grid';

export interface WhiteFloorOptions {
  /** fixed band [lo, hi] Hz: the floor is the mean of the linear S_ν values in it (no search) */
  bandHz?: [number, number];
  /** lowest frequency the search may use, Hz; default 4 × the lowest positive grid frequency */
  minHz?: number;
  /** highest frequency the search may use, Hz; default the top grid frequency / 5 (≈ fs/10) */
  maxHz?: number;
  /** width of the sliding search window, decades (>= 0.5); default 0.5 */
  windowDecades?: number;
  /** known spurs: grid points next to them are left out of the search and of the mean */
  spurs?: readonly Spur[];
}

type ResolvedWhiteFloorOptions =
  | { mode: 'band'; lowHz: number; highHz: number; spurHz: number[] }
  | { mode: 'auto'; lowHz: number; highHz: number; windowDecades: number; spurHz: number[] };

const BINS_PER_DECADE = 20;
/** white-dominated when |log-log slope| <= this at both window edges (h0 > 3·other terms) */
const FLAT_SLOPE = 0.25;
/** windows within this fraction (+ 2 standard errors) of the lowest flat level count as "lowest" */
const LEVEL_TOLERANCE = 0.003;
/** a final band leaning more than this (log-log slope) gets a warning: other noise adds ≈ |slope| to the floor */
const LEAN_SLOPE = 0.1;
/** a point more than this × its bin's median is a spur point */
const SPUR_POINT_RATIO = 10;

function resolveWhiteFloorOptions(spectrum: Spectrum, options: WhiteFloorOptions): ResolvedWhiteFloorOptions {
  checkSpectrum(spectrum, 'whiteFloor');
  const f = spectrum.frequencyHz;
  const spurHz: number[] = [];
  for (const spur of options.spurs ?? []) {
    if (!Number.isFinite(spur?.frequencyHz)) {
      throw new AnalysisInputError(`whiteFloor: every spur needs a finite frequencyHz, got ${spur?.frequencyHz}`);
    }
    spurHz.push(spur.frequencyHz);
  }
  if (options.bandHz !== undefined) {
    const [lo, hi] = options.bandHz;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo <= 0 || hi <= lo) {
      throw new AnalysisInputError(`whiteFloor: bandHz must be [lo, hi] with 0 < lo < hi, got [${lo}, ${hi}]`);
    }
    return { mode: 'band', lowHz: lo, highHz: hi, spurHz };
  }
  const firstPositive = f[0] > 0 ? f[0] : f[1];
  const lowHz = options.minHz ?? 4 * firstPositive;
  const highHz = options.maxHz ?? f[f.length - 1] / 5;
  if (!Number.isFinite(lowHz) || lowHz <= 0) {
    throw new AnalysisInputError(`whiteFloor: minHz must be a positive number, got ${lowHz}`);
  }
  if (!Number.isFinite(highHz) || highHz <= lowHz) {
    throw new AnalysisInputError(`whiteFloor: maxHz must be above minHz = ${lowHz} Hz, got ${highHz}`);
  }
  const windowDecades = options.windowDecades ?? 0.5;
  if (!Number.isFinite(windowDecades) || windowDecades < 0.5) {
    throw new AnalysisInputError(`whiteFloor: windowDecades must be >= 0.5, got ${windowDecades}`);
  }
  return { mode: 'auto', lowHz, highHz, windowDecades, spurHz };
}

/** Indices of points in [lo, hi] (f > 0) that are not the grid neighbours of a given spur. */
function pickPoints(f: Float64Array, lo: number, hi: number, spurHz: number[]): number[] {
  const picked: number[] = [];
  for (let i = 0; i < f.length; i++) {
    if (!(f[i] >= lo && f[i] <= hi && f[i] > 0)) continue;
    const left = i > 0 ? f[i - 1] : f[i];
    const right = i + 1 < f.length ? f[i + 1] : f[i];
    if (spurHz.some((x) => x >= left && x <= right)) continue;
    picked.push(i);
  }
  return picked;
}

/** least-squares slope of ln S against ln f over the points (0 when fewer than 2 usable) */
function logLogSlope(f: Float64Array, s: Float64Array, idx: number[]): number {
  let n = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let sxy = 0;
  for (const i of idx) {
    if (!(s[i] > 0)) continue;
    const x = Math.log(f[i]);
    const y = Math.log(s[i]);
    n++;
    sx += x;
    sy += y;
    sxx += x * x;
    sxy += x * y;
  }
  const den = n * sxx - sx * sx;
  return n >= 2 && den > 0 ? (n * sxy - sx * sy) / den : 0;
}

interface LogBin {
  /** mean log10 f of the points */
  x: number;
  /** Σ S (linear) and the number of points */
  sum: number;
  count: number;
  /** relative variance of the points about the bin mean (NaN under 3 points) */
  relVar: number;
  /** grid indices of the points kept */
  points: number[];
}

interface WindowFit {
  from: number; // first bin index
  to: number; // last bin index, inclusive
  /** larger |log-log slope| at the two window edges (point estimate) */
  edgeSlope: number;
  /** larger of |edge slope| − 2·(its standard error): the noise-tolerant flatness test */
  edgeSlopeLow: number;
  /** mean linear S of the points, and its relative standard error */
  level: number;
  levelRelErr: number;
}

const LOG10_E = Math.LOG10E;

/** inverse of a symmetric 3×3 matrix [a b c; b d e; c e f] (null when singular) */
function inverse3(a: number, b: number, c: number, d: number, e: number, f: number): number[] | null {
  const A = d * f - e * e;
  const B = c * e - b * f;
  const C = b * e - c * d;
  const det = a * A + b * B + c * C;
  if (!(Math.abs(det) > 0)) return null;
  const D = a * f - c * c;
  const E = b * c - a * e;
  const F = a * d - b * b;
  return [A / det, B / det, C / det, D / det, E / det, F / det];
}

/**
 * Weighted parabola fit of y_b = log10(bin mean) on u_b = x_b − x̄, weights = point counts
 * (var y_b = σ_y²/count_b, σ_y = log10(e)·σ_rel). Returns the window's flatness figures.
 */
function fitWindow(bins: (LogBin | null)[], from: number, to: number, relVarGlobal: number): WindowFit | null {
  const list: LogBin[] = [];
  for (let b = from; b <= to; b++) if (bins[b]) list.push(bins[b] as LogBin);
  const n = list.length;
  if (n < 4) return null;
  let wsum = 0;
  let xm = 0;
  let sum = 0;
  let count = 0;
  for (const bin of list) {
    wsum += bin.count;
    xm += bin.count * bin.x;
    sum += bin.sum;
    count += bin.count;
  }
  xm /= wsum;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  for (const bin of list) {
    const w = bin.count;
    const u = bin.x - xm;
    const y = Math.log10(bin.sum / bin.count);
    s0 += w;
    s1 += w * u;
    s2 += w * u * u;
    s3 += w * u * u * u;
    s4 += w * u * u * u * u;
    t0 += w * y;
    t1 += w * y * u;
    t2 += w * y * u * u;
  }
  const inv = inverse3(s0, s1, s2, s2, s3, s4);
  if (!inv) return null;
  const [i00, i01, i02, i11, i12, i22] = inv;
  const c0 = i00 * t0 + i01 * t1 + i02 * t2;
  const c1 = i01 * t0 + i11 * t1 + i12 * t2;
  const c2 = i02 * t0 + i12 * t1 + i22 * t2;
  // σ_y² per unit weight: from the within-bin scatter when known, else from the residuals
  let sigma2: number;
  if (Number.isFinite(relVarGlobal)) {
    sigma2 = LOG10_E * LOG10_E * relVarGlobal;
  } else {
    let ss = 0;
    for (const bin of list) {
      const u = bin.x - xm;
      const r = Math.log10(bin.sum / bin.count) - (c0 + c1 * u + c2 * u * u);
      ss += bin.count * r * r;
    }
    sigma2 = ss / (n - 3);
  }
  let edgeSlope = 0;
  let edgeSlopeLow = -Infinity;
  for (const u of [list[0].x - xm, list[n - 1].x - xm]) {
    // slope d log10 S / d log10 f at the edge: c1 + 2 c2 u; var = σ²(i11 + 4u² i22 + 4u i12)
    const e = Math.abs(c1 + 2 * c2 * u);
    const se = Math.sqrt(Math.max(0, sigma2 * (i11 + 4 * u * u * i22 + 4 * u * i12)));
    edgeSlope = Math.max(edgeSlope, e);
    edgeSlopeLow = Math.max(edgeSlopeLow, e - 2 * se);
  }
  const relErr = Math.sqrt(sigma2 / (LOG10_E * LOG10_E) / count);
  return { from, to, edgeSlope, edgeSlopeLow, level: sum / count, levelRelErr: relErr };
}

function finish(
  f: Float64Array,
  s: Float64Array,
  idx: number[],
  mode: 'auto' | 'band',
  warnings: string[],
): WhiteFloorResult {
  let sum = 0;
  for (const i of idx) sum += s[i];
  const value = sum / idx.length; // mean of linear S_ν values (not dB)
  return {
    valueHz2PerHz: value,
    bandHz: [f[idx[0]], f[idx[idx.length - 1]]],
    // Δν = π·S_ν,white (Lorentzian FWHM)
    intrinsicLinewidthHz: Math.PI * value,
    mode,
    pointCount: idx.length,
    slope: logLogSlope(f, s, idx),
    warnings,
  };
}

export function whiteFloor(spectrum: Spectrum, options: WhiteFloorOptions = {}): WhiteFloorResult {
  const o = resolveWhiteFloorOptions(spectrum, options);
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const warnings: string[] = [];

  if (o.mode === 'band') {
    const idx = pickPoints(f, o.lowHz, o.highHz, o.spurHz);
    if (idx.length === 0) {
      throw new AnalysisInputError(`whiteFloor: the band [${o.lowHz}, ${o.highHz}] Hz holds no grid point`);
    }
    const slope = logLogSlope(f, s, idx);
    if (idx.length < 3) warnings.push(`only ${idx.length} point(s) in the band: the floor is poorly averaged`);
    else if (Math.abs(slope) > FLAT_SLOPE) {
      warnings.push(
        `the white term does not dominate in this band: log-log slope ${slope.toFixed(2)} (a white floor is flat)`,
      );
    }
    return finish(f, s, idx, 'band', warnings);
  }

  // 1–2: points of the search range, gathered into log bins; spur points (> 10 × bin median) dropped
  const picked = pickPoints(f, o.lowHz, o.highHz, o.spurHz).filter((i) => s[i] > 0);
  if (picked.length < 4) {
    throw new AnalysisInputError(
      `whiteFloor: the search range [${o.lowHz}, ${o.highHz}] Hz holds ${picked.length} usable points; at least 4 are needed`,
    );
  }
  const groups = new Map<number, number[]>();
  for (const i of picked) {
    const key = Math.floor(Math.log10(f[i]) * BINS_PER_DECADE);
    const g = groups.get(key);
    if (g) g.push(i);
    else groups.set(key, [i]);
  }
  const keys = [...groups.keys()].sort((p, q) => p - q);
  const bins: (LogBin | null)[] = [];
  const relVars: number[] = [];
  let dropped = 0;
  for (let key = keys[0]; key <= keys[keys.length - 1]; key++) {
    const g = groups.get(key);
    if (!g) {
      bins.push(null);
      continue;
    }
    const sorted = g.map((i) => s[i]).sort((p, q) => p - q);
    const median = sorted[sorted.length >> 1];
    const points = g.length >= 3 ? g.filter((i) => s[i] <= SPUR_POINT_RATIO * median) : g;
    dropped += g.length - points.length;
    let sum = 0;
    let xsum = 0;
    for (const i of points) {
      sum += s[i];
      xsum += Math.log10(f[i]);
    }
    const mean = sum / points.length;
    let relVar = NaN;
    if (points.length >= 3) {
      let v = 0;
      for (const i of points) v += (s[i] / mean - 1) ** 2;
      relVar = v / (points.length - 1);
      relVars.push(relVar);
    }
    bins.push({ x: xsum / points.length, sum, count: points.length, relVar, points });
  }
  // per-point relative variance: median over bins with >= 3 points (NaN → use fit residuals)
  relVars.sort((p, q) => p - q);
  const relVarGlobal = relVars.length > 0 ? relVars[relVars.length >> 1] : NaN;

  // 3: sliding window over the bins
  const width = Math.max(4, Math.round(o.windowDecades * BINS_PER_DECADE));
  const fits: WindowFit[] = [];
  if (bins.length <= width) {
    const fit = fitWindow(bins, 0, bins.length - 1, relVarGlobal);
    if (fit) fits.push(fit);
    warnings.push(
      `the search range [${o.lowHz}, ${o.highHz}] Hz is narrower than the ${o.windowDecades}-decade window: the whole range was used`,
    );
  } else {
    for (let from = 0; from + width - 1 < bins.length; from++) {
      let filled = 0;
      for (let b = from; b < from + width; b++) if (bins[b]) filled++;
      if (filled < width / 2) continue; // at least half of the window's bins must hold points
      const fit = fitWindow(bins, from, from + width - 1, relVarGlobal);
      if (fit) fits.push(fit);
    }
  }
  const pointsOf = (from: number, to: number) => {
    const idx: number[] = [];
    for (let b = from; b <= to; b++) if (bins[b]) idx.push(...(bins[b] as LogBin).points);
    return idx.sort((p, q) => p - q);
  };
  if (dropped > 0) warnings.push(`${dropped} point(s) more than 10× their log bin's median were left out as spurs`);
  if (fits.length === 0) {
    // too few bins for a window (e.g. a sparse linear grid): every kept point
    warnings.push('too few points per decade for the band search: the floor is the mean over the whole search range');
    return finish(f, s, pointsOf(0, bins.length - 1), 'auto', warnings);
  }

  // 4: white-dominated windows: both edge slopes within 0.25 (allowing 2 standard errors of noise)
  const flat = fits.filter((w) => w.edgeSlopeLow <= FLAT_SLOPE);
  if (flat.length === 0) {
    let best = fits[0];
    for (const w of fits) if (w.edgeSlopeLow < best.edgeSlopeLow) best = w;
    const idx = pointsOf(best.from, best.to);
    warnings.push(
      `no band where the white term dominates: the flattest ${o.windowDecades}-decade band ` +
        `(${f[idx[0]].toPrecision(3)}–${f[idx[idx.length - 1]].toPrecision(3)} Hz) still has an edge log-log slope of ` +
        `${best.edgeSlope.toFixed(2)}; its mean is an upper bound of the white floor`,
    );
    return finish(f, s, idx, 'auto', warnings);
  }
  // 5: lowest level; near-lowest = within 1 % + 2 standard errors; the flattest of those, grown over
  // the contiguous near-lowest flat windows around it
  let lowest = flat[0];
  for (const w of flat) if (w.level < lowest.level) lowest = w;
  const limit = lowest.level * (1 + LEVEL_TOLERANCE + 2 * lowest.levelRelErr);
  const near = new Map<number, WindowFit>();
  for (const w of flat) if (w.level <= limit) near.set(w.from, w);
  let chosen = lowest;
  for (const w of near.values()) if (w.edgeSlope < chosen.edgeSlope) chosen = w;
  let from = chosen.from;
  let to = chosen.to;
  for (let k = chosen.from - 1; near.has(k); k--) from = k;
  for (let k = chosen.from + 1; near.has(k); k++) to = (near.get(k) as WindowFit).to;
  const result = finish(f, s, pointsOf(from, to), 'auto', warnings);
  if (Math.abs(result.slope) > LEAN_SLOPE) {
    // for S = h0 + X with X ∝ f^k the slope is k·X/S: flicker (k = −1) adds ≈ |slope| of the level
    warnings.push(
      `the floor band still has a log-log slope of ${result.slope.toFixed(2)}: flicker or detection noise adds roughly ` +
        `${Math.round(100 * Math.abs(result.slope))} % to the floor there`,
    );
  }
  return result;
}
