/**
 * White frequency-noise floor S_ν,white and the intrinsic (Lorentzian) linewidth π·S_ν,white.
 *
 * Usage:
 *   import { whiteFloor } from '../analysis/linewidth/white-floor';
 *   const auto = whiteFloor(logSpectrum);                              // flattest low band, found automatically
 *   const fitted = whiteFloor(logSpectrum, { model, spurs });          // … less the model's flicker/random walk
 *   const given = whiteFloor(logSpectrum, { bandHz: [1e4, 1e5] });     // mean of linear S_ν over a band
 *   auto.valueHz2PerHz; auto.intrinsicLinewidthHz; auto.bandHz; auto.warnings; auto.notes
 *
 * Physics: white frequency noise S_ν = h0 (one-sided, Hz²/Hz) gives Γ(τ) = exp(−π²h0|τ|), a Lorentzian
 * line of FWHM Δν = π·h0 (Elliott, Roy, Smith, Phys. Rev. A 26, 12 (1982); Phaseloom METHODS 3.2).
 * Averages: when the spectrum carries per-point averages K_j (a log-frequency or Welch spectrum), point j
 * has relative variance c/K_j (METHODS 1.3; c ≈ 1 for one Welch bin, up to ≈ 2 for a log point merging
 * correlated Hann bins, and estimated from the scatter, never below 1), so every mean below is weighted
 * by K_j (inverse variance) and every standard error is √(c/ΣK). c is estimated once over the search
 * range, robustly, from each point against its two neighbours (1.4826·MAD), at least 1 with averages;
 * a plain Spectrum has K_j = 1 and c from that scatter alone.
 * Floor over a given band: the mean of the linear S_ν values of the grid points in [lo, hi], K-weighted
 * (never a mean of dB values, which is biased low: METHODS 3.2).
 * Automatic band (our own search rule, stated here):
 *  1. Search range: minHz (default 4 × the lowest positive grid frequency — Welch bins m < 4 are
 *     biased by leakage, METHODS 1.4) to maxHz (default top/5, i.e. fs/10 for a spectrum reaching
 *     Nyquist — METHODS 2.4: below fs/10 the finite-difference and aliasing effects stay under 3.4 %).
 *     Points next to given spurs, points inside given excluded spans (bumps), and points more than 10×
 *     their log bin's median are left out.
 *  2. The points are gathered into log bins of 1/20 decade (K-weighted mean of linear S_ν in each bin).
 *  3. A window of `windowDecades` (default ½ decade) slides over the bins; in each, log10 S is fitted
 *     by a parabola in log10 f (weights ΣK per bin) and the log-log slope is read at both window edges,
 *     with its standard error from the per-point variance c/K_j.
 *  4. A window is "white-dominated" when both edge slopes are within 0.25 (less 2 standard errors):
 *     for S = h0 + X with X ∝ f^k the local slope is k·X/S, and |slope| < 0.25 with |k| = 1 is
 *     METHODS 3.2's h0 > 3·X.
 *  5. Among white-dominated windows the lowest wins (white noise is the floor under bumps, spurs and the
 *     f² detection rise) — but only where it is lower beyond noise: the reference starts at the
 *     best-determined white-dominated window (smallest s.e. of its level) and moves to another only
 *     while that one lies lower by more than 5 combined standard errors (a window of few averages
 *     cannot win by a downward fluctuation: ~100 overlapping windows are compared, and a stretch of a
 *     single record can read 3.5 s.e. low; a floor under a bump or a detection rise stands much lower
 *     than that). The windows agreeing with the reference (within 0.3 % + 2 combined standard errors)
 *     are "near"; the reference grown over the contiguous near windows around it is the band. If no
 *     window qualifies, the flattest window is used and a warning says so.
 *  6. With a fitted noise model (`model`, analysis/noise/model-fit.ts) the model's coloured terms
 *     a₋₁/f + a₋₂/f² are subtracted point by point before the band's mean — METHODS 3.2 estimates h0 as
 *     the white term of S = h0 + h₋₁/f (+ …), not as the raw level of a band where flicker still adds.
 *     A note gives the share subtracted; past 25 % (h0 < 3 × the rest, METHODS 3.2) it is a warning;
 *     past 50 % (h0 below the rest) nothing is subtracted and the band's mean is reported as an upper
 *     bound, with a warning.
 *     Without a model, a band still leaning by more than 0.1 in log-log slope is reported with a
 *     warning (flicker adds ≈ |slope|).
 * Worked check: S_ν = 10⁴ Hz²/Hz everywhere → floor 10⁴, intrinsic linewidth 31415.93 Hz.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum, Spur, WhiteFloorResult } from '../types';
import { checkSpectrum, pointAverages } from './spectrum-grid';

/** The coloured terms of a fitted power-law model (analysis/noise/model-fit.ts), Hz² and Hz³. */
export interface ColouredNoiseTerms {
  flickerHz2: number;
  randomWalkHz3: number;
}

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
  /** spans [lo, hi] Hz left out of the search (broad bumps) */
  excludeHz?: readonly [number, number][];
  /** automatic band: subtract these fitted coloured terms (a₋₁/f + a₋₂/f²) before the mean */
  model?: ColouredNoiseTerms;
}

/** The floor with what was subtracted and how it was found, as notes apart from the warnings. */
export interface WhiteFloorReport extends WhiteFloorResult {
  /** K-weighted mean of the model's a₋₁/f + a₋₂/f² over the band, subtracted from the raw level (0 without a model) */
  colouredHz2PerHz: number;
  notes: string[];
}

type ResolvedWhiteFloorOptions =
  | { mode: 'band'; lowHz: number; highHz: number; spurHz: number[]; exclude: [number, number][] }
  | {
      mode: 'auto';
      lowHz: number;
      highHz: number;
      windowDecades: number;
      spurHz: number[];
      exclude: [number, number][];
      model: ColouredNoiseTerms | null;
    };

const BINS_PER_DECADE = 20;
/** white-dominated when |log-log slope| <= this at both window edges (h0 > 3·other terms) */
const FLAT_SLOPE = 0.25;
/** windows within this fraction (+ 2 standard errors) of the lowest flat level count as "near" */
const LEVEL_TOLERANCE = 0.003;
/** a flat window replaces the reference only when lower by this many combined standard errors (one of ~100 windows) */
const LOWER_SIGMAS = 5;
/** a final band leaning more than this (log-log slope) gets a warning: other noise adds ≈ |slope| to the floor */
const LEAN_SLOPE = 0.1;
/** a point more than this × its bin's median is a spur point */
const SPUR_POINT_RATIO = 10;
/** subtracted coloured part above this share of the band's level: the white term does not dominate */
const COLOURED_WARNING_SHARE = 0.25;
/** … above this share nothing is subtracted: the band's mean is reported as an upper bound */
const COLOURED_LIMIT_SHARE = 0.5;

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
  const exclude: [number, number][] = [];
  for (const span of options.excludeHz ?? []) {
    if (!Array.isArray(span) || span.length !== 2 || !Number.isFinite(span[0]) || !Number.isFinite(span[1]) || span[1] < span[0]) {
      throw new AnalysisInputError(`whiteFloor: every excluded span must be [lo, hi] Hz with lo <= hi, got ${String(span)}`);
    }
    exclude.push([span[0], span[1]]);
  }
  if (options.bandHz !== undefined) {
    const [lo, hi] = options.bandHz;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo <= 0 || hi <= lo) {
      throw new AnalysisInputError(`whiteFloor: bandHz must be [lo, hi] with 0 < lo < hi, got [${lo}, ${hi}]`);
    }
    return { mode: 'band', lowHz: lo, highHz: hi, spurHz, exclude };
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
  const model = options.model ?? null;
  if (model !== null) {
    for (const [name, v] of Object.entries({ flickerHz2: model.flickerHz2, randomWalkHz3: model.randomWalkHz3 })) {
      if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
        throw new AnalysisInputError(`whiteFloor: model.${name} must be a finite number >= 0, got ${v}`);
      }
    }
  }
  return { mode: 'auto', lowHz, highHz, windowDecades, spurHz, exclude, model };
}

/** Indices of points in [lo, hi] (f > 0) that are not the grid neighbours of a given spur nor inside an excluded span. */
function pickPoints(f: Float64Array, lo: number, hi: number, spurHz: number[], exclude: [number, number][]): number[] {
  const picked: number[] = [];
  for (let i = 0; i < f.length; i++) {
    if (!(f[i] >= lo && f[i] <= hi && f[i] > 0)) continue;
    const left = i > 0 ? f[i - 1] : f[i];
    const right = i + 1 < f.length ? f[i + 1] : f[i];
    if (spurHz.some((x) => x >= left && x <= right)) continue;
    if (exclude.some(([a, b]) => f[i] >= a && f[i] <= b)) continue;
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
  /** K-weighted mean of S (linear) and ΣK */
  mean: number;
  weight: number;
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
  /** K-weighted mean of S over the points, and its relative standard error √(c/ΣK) */
  level: number;
  levelRelErr: number;
}

const LOG10_E = Math.LOG10E;

/**
 * Variance scale c (a point's relative variance is c/K_j) from each point against the K-weighted mean of
 * its two neighbours: r = (S_j/S̄ − 1)/√(1/K_j + 1/(K_{j−1} + K_{j+1})), c = (1.4826·MAD(r))² (robust to
 * spurs and bumps; a power-law slope changes S̄ by only ~α²(Δln f)²/2). NaN with fewer than 5 triples.
 */
function varianceScale(s: Float64Array, kOf: (i: number) => number, idx: number[]): number {
  const r: number[] = [];
  for (let j = 1; j + 1 < idx.length; j++) {
    const [a, b, c] = [idx[j - 1], idx[j], idx[j + 1]];
    const ka = kOf(a);
    const kc = kOf(c);
    const mean = (ka * s[a] + kc * s[c]) / (ka + kc);
    if (!(mean > 0)) continue;
    r.push((s[b] / mean - 1) / Math.sqrt(1 / kOf(b) + 1 / (ka + kc)));
  }
  if (r.length < 5) return NaN;
  const median = (v: number[]) => {
    const sorted = [...v].sort((p, q) => p - q);
    const n = sorted.length;
    return n % 2 === 1 ? sorted[n >> 1] : 0.5 * (sorted[n / 2 - 1] + sorted[n / 2]);
  };
  const mid = median(r);
  const sd = 1.4826 * median(r.map((x) => Math.abs(x - mid)));
  return sd * sd;
}

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
 * Weighted parabola fit of y_b = log10(bin mean) on u_b = x_b − x̄, weights ΣK_b
 * (var y_b = log10(e)²·c/ΣK_b). Returns the window's flatness figures. `scale` is c, or NaN to take
 * it from the window's residuals (then at least `minScale`).
 */
function fitWindow(bins: (LogBin | null)[], from: number, to: number, scale: number, minScale: number): WindowFit | null {
  const list: LogBin[] = [];
  for (let b = from; b <= to; b++) if (bins[b]) list.push(bins[b] as LogBin);
  const n = list.length;
  if (n < 4) return null;
  let wsum = 0;
  let xm = 0;
  let sum = 0;
  for (const bin of list) {
    wsum += bin.weight;
    xm += bin.weight * bin.x;
    sum += bin.weight * bin.mean;
  }
  xm /= wsum;
  let s0 = 0, s1 = 0, s2 = 0, s3 = 0, s4 = 0, t0 = 0, t1 = 0, t2 = 0;
  for (const bin of list) {
    const w = bin.weight;
    const u = bin.x - xm;
    const y = Math.log10(bin.mean);
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
  // c: from the within-bin scatter when known, else from the residuals
  let c = scale;
  if (!Number.isFinite(c)) {
    let ss = 0;
    for (const bin of list) {
      const u = bin.x - xm;
      const r = Math.log10(bin.mean) - (c0 + c1 * u + c2 * u * u);
      ss += bin.weight * r * r;
    }
    c = Math.max(minScale, ss / (n - 3) / (LOG10_E * LOG10_E));
  }
  const sigma2 = LOG10_E * LOG10_E * c;
  let edgeSlope = 0;
  let edgeSlopeLow = -Infinity;
  for (const u of [list[0].x - xm, list[n - 1].x - xm]) {
    // slope d log10 S / d log10 f at the edge: c1 + 2 c2 u; var = σ²(i11 + 4u² i22 + 4u i12)
    const e = Math.abs(c1 + 2 * c2 * u);
    const se = Math.sqrt(Math.max(0, sigma2 * (i11 + 4 * u * u * i22 + 4 * u * i12)));
    edgeSlope = Math.max(edgeSlope, e);
    edgeSlopeLow = Math.max(edgeSlopeLow, e - 2 * se);
  }
  return { from, to, edgeSlope, edgeSlopeLow, level: sum / wsum, levelRelErr: Math.sqrt(c / wsum) };
}

function finish(
  f: Float64Array,
  s: Float64Array,
  k: Float64Array | null,
  idx: number[],
  mode: 'auto' | 'band',
  model: ColouredNoiseTerms | null,
  warnings: string[],
  notes: string[],
): WhiteFloorReport {
  let sum = 0;
  let coloured = 0;
  let weight = 0;
  for (const i of idx) {
    const w = k ? k[i] : 1;
    sum += w * s[i];
    if (model) coloured += w * (model.flickerHz2 / f[i] + model.randomWalkHz3 / (f[i] * f[i]));
    weight += w;
  }
  const raw = sum / weight; // K-weighted mean of linear S_ν values (not dB)
  coloured /= weight;
  const slope = logLogSlope(f, s, idx);
  const bandHz: [number, number] = [f[idx[0]], f[idx[idx.length - 1]]];
  const share = coloured / raw;
  const where = `over the floor band (${bandHz[0].toPrecision(3)}–${bandHz[1].toPrecision(3)} Hz)`;
  if (model && share > COLOURED_LIMIT_SHARE) {
    // h0 below the other terms everywhere: a difference of two near-equal numbers is no estimate
    coloured = 0;
    warnings.push(
      `the white term does not dominate anywhere in the search range: the noise model's flicker/random-walk part is ` +
        `${Math.round(100 * share)} % of S_ν ${where}; the band's mean is given, an upper bound of the white floor`,
    );
  } else if (model && coloured > 0) {
    const text = `the noise model's flicker/random-walk part, ${(100 * share).toFixed(1)} % of S_ν ${where}, was subtracted from the white floor`;
    if (share > COLOURED_WARNING_SHARE) {
      warnings.push(`${text}: the white term does not dominate there, so the floor rests on the noise model`);
    } else {
      notes.push(text);
    }
  } else if (mode === 'auto' && Math.abs(slope) > LEAN_SLOPE) {
    // for S = h0 + X with X ∝ f^k the slope is k·X/S: flicker (k = −1) adds ≈ |slope| of the level
    warnings.push(
      `the floor band still has a log-log slope of ${slope.toFixed(2)}: flicker or detection noise adds roughly ` +
        `${Math.round(100 * Math.abs(slope))} % to the floor there`,
    );
  }
  const value = raw - coloured;
  return {
    valueHz2PerHz: value,
    bandHz,
    // Δν = π·S_ν,white (Lorentzian FWHM)
    intrinsicLinewidthHz: Math.PI * value,
    mode,
    pointCount: idx.length,
    slope,
    colouredHz2PerHz: coloured,
    warnings,
    notes,
  };
}

export function whiteFloor(spectrum: Spectrum, options: WhiteFloorOptions = {}): WhiteFloorReport {
  const o = resolveWhiteFloorOptions(spectrum, options);
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const k = pointAverages(spectrum, 'whiteFloor');
  const kOf = (i: number) => (k ? k[i] : 1);
  const warnings: string[] = [];
  const notes: string[] = [];

  if (o.mode === 'band') {
    const idx = pickPoints(f, o.lowHz, o.highHz, o.spurHz, o.exclude);
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
    return finish(f, s, k, idx, 'band', null, warnings, notes);
  }

  // 1–2: points of the search range, gathered into log bins; spur points (> 10 × bin median) dropped
  const picked = pickPoints(f, o.lowHz, o.highHz, o.spurHz, o.exclude).filter((i) => s[i] > 0);
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
    let weight = 0;
    let xsum = 0;
    for (const i of points) {
      sum += kOf(i) * s[i];
      weight += kOf(i);
      xsum += Math.log10(f[i]);
    }
    const mean = sum / weight;
    bins.push({ x: xsum / points.length, mean, weight, points });
  }
  // variance scale c from neighbouring points (NaN → each window's residuals); >= 1 with averages
  const minScale = k ? 1 : 0;
  const kept: number[] = [];
  for (const bin of bins) if (bin) kept.push(...bin.points);
  kept.sort((p, q) => p - q);
  const neighbourScale = varianceScale(s, kOf, kept);
  const scale = Number.isFinite(neighbourScale) ? Math.max(minScale, neighbourScale) : NaN;

  // 3: sliding window over the bins
  const width = Math.max(4, Math.round(o.windowDecades * BINS_PER_DECADE));
  const fits: WindowFit[] = [];
  if (bins.length <= width) {
    const fit = fitWindow(bins, 0, bins.length - 1, scale, minScale);
    if (fit) fits.push(fit);
    warnings.push(
      `the search range [${o.lowHz}, ${o.highHz}] Hz is narrower than the ${o.windowDecades}-decade window: the whole range was used`,
    );
  } else {
    for (let from = 0; from + width - 1 < bins.length; from++) {
      let filled = 0;
      for (let b = from; b < from + width; b++) if (bins[b]) filled++;
      if (filled < width / 2) continue; // at least half of the window's bins must hold points
      const fit = fitWindow(bins, from, from + width - 1, scale, minScale);
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
    return finish(f, s, k, pointsOf(0, bins.length - 1), 'auto', o.model, warnings, notes);
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
    return finish(f, s, k, idx, 'auto', o.model, warnings, notes);
  }
  // 5: the reference starts at the best-determined flat window and moves to a flat window only while
  // that one is lower beyond 5 combined standard errors; near = agreeing with the reference within
  // 0.3 % + 2 combined standard errors; the band is the reference grown over the contiguous near windows
  let ref = flat[0];
  for (const w of flat) if (w.levelRelErr < ref.levelRelErr) ref = w;
  for (;;) {
    let next: WindowFit | null = null;
    for (const w of flat) {
      const lower = w.level < ref.level * (1 - LOWER_SIGMAS * Math.hypot(w.levelRelErr, ref.levelRelErr));
      if (lower && (next === null || w.level * (1 + 2 * w.levelRelErr) < next.level * (1 + 2 * next.levelRelErr))) next = w;
    }
    if (next === null) break;
    ref = next;
  }
  const near = new Set<number>();
  for (const w of flat) {
    if (Math.abs(w.level - ref.level) <= ref.level * (LEVEL_TOLERANCE + 2 * Math.hypot(w.levelRelErr, ref.levelRelErr))) near.add(w.from);
  }
  let from = ref.from;
  let to = ref.to;
  const byFrom = new Map(flat.map((w) => [w.from, w]));
  for (let b = ref.from - 1; near.has(b); b--) from = b;
  for (let b = ref.from + 1; near.has(b); b++) to = (byFrom.get(b) as WindowFit).to;
  return finish(f, s, k, pointsOf(from, to), 'auto', o.model, warnings, notes);
}
