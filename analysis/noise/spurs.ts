/**
 * Spurs and bumps: narrow lines (mains, pump, clock pick-up) and broad features (relaxation-oscillation and
 * servo bumps) standing above the fitted noise model.
 *
 * Usage:
 *   import { findSpurs, findSpectralFeatures } from '../analysis/noise/spurs';
 *   const model = fitNoiseModel(logSpectrum);
 *   const spurs = findSpurs(welchSpectrum, model);                 // narrow lines only (linear Welch grid)
 *   const { spurs, bumps } = findSpectralFeatures(welchSpectrum, model);
 *   spurs[0].frequencyHz; spurs[0].heightDb; spurs[0].powerHz2; bumps[0].centerHz; bumps[0].widthHz
 *
 * Candidates: a grid point is a candidate when S_ν(f) > M(f)·10^(threshold/10), M = the fitted power-law
 * model S_ν = a₀ + a₋₁/f + a₋₂/f² (model-fit.ts), threshold 10 dB by default; candidates no more than
 * `mergeGapPoints` grid steps apart form one group, whose highest point is its peak. The threshold is far
 * above Welch scatter: with K_eff averages a bin exceeds its mean by 10 dB with probability
 * P(χ²_{2K}/2K > 10) — e^−10 ≈ 4.5e−5 for K = 1, negligible for K >= 4.
 * Line or bump (our rule, stated here): a windowed line puts its power within the window's main lobe,
 * ±h bins of the line (h = 2 Hann, 4 four-term Blackman–Harris, 5 five-term flat-top: a cosine sum with
 * terms up to cos(h−1)z has its first zero at h bins — F. J. Harris, "On the use of windows for harmonic
 * analysis with the discrete Fourier transform", Proc. IEEE 66(1), 51–83 (1978)). Its shoulders — the
 * points between h+1 and h+4 local bins (resolution r at the peak) on either side — then lie at the
 * background. A group is a line (a spur) when its peak stands above the higher of its two shoulder means
 * B by at least 3/4 of its excess over the model: S_p − B >= 0.75·(S_p − M_p). Otherwise it is broad —
 * a bump: its excess S − M is smoothed by a running mean over ±(h+1) points; the bump's centre and
 * width are the midpoint and the distance of the half-excess points around the smoothed maximum (linear
 * interpolation), its height the smoothed maximum over the model; it reaches out while the smoothed
 * S stands more than half the threshold (in dB) above the model, and every group inside that reach
 * belongs to it (a bump crossing the threshold in scattered patches is one bump, not many spurs).
 * Groups are taken highest first, so a bump absorbs the patches of its skirts.
 * Each spur reports its frequency (the peak, refined by a parabola through ln S_ν of it and its two
 * neighbours when the grid is locally even), its height 10·log10(S_ν/M) at the peak, dB above the model
 * (it depends on the resolution bandwidth), and its power: Σ (S_ν − M)·r over the main lobe (points of
 * the peak's stage within ±(h + ½)·r) — the line's power whatever the window, since a window's kernel
 * summed over all bins is its ENBW in bins; an FM tone of peak deviation Δ carries Δ²/2 Hz².
 * Resolution r: the spectrum's `resolutionHz` per point when it carries one (log-frequency cascade), else
 * the local grid step. Window: the spectrum's `window` when it names one, else `window` option ('hann').
 * Defaults: threshold 10 dB, band = the whole spectrum above 0 Hz, merge gap 2 points, at most 100
 * spurs (the highest kept), spurs and bumps returned in increasing frequency.
 * Worked check: a line 20 dB above a flat model on bin 50 of a 1 Hz grid → one spur, 50 Hz, 20 dB.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum, Spur, WindowName } from '../types';
import { checkSpectrum } from '../linewidth/spectrum-grid';
import { evaluateNoiseModel, type NoiseModelCoefficients } from './model-fit';

export interface SpurOptions {
  /** a point is part of a spur when S_ν > model · 10^(thresholdDb/10); default 10 dB */
  thresholdDb?: number;
  /** band [lo, hi] Hz searched; default the whole spectrum above 0 Hz */
  bandHz?: [number, number];
  /** points above the threshold closer than this many grid steps belong to the same spur; default 2 */
  mergeGapPoints?: number;
  /** keep at most this many (the highest); default 100 */
  maxSpurs?: number;
  /** window of the Welch estimate, when the spectrum does not name it; default 'hann' */
  window?: WindowName;
}

/** A narrow line. */
export interface SpurLine extends Spur {
  /** power of the line above the model over its main lobe, Hz² (an FM tone of peak deviation Δ: Δ²/2) */
  powerHz2: number;
  /** frequency resolution (bin width) at the line, Hz: the height in dB is read at this RBW × the window's ENBW */
  resolutionHz: number;
}

/** A broad feature above the model (relaxation-oscillation or servo bump). */
export interface SpectralBump {
  /** midpoint of the half-excess points, Hz */
  centerHz: number;
  /** full width at half the (smoothed) excess over the model, Hz */
  widthHz: number;
  /** smoothed maximum over the model, dB */
  heightDb: number;
  /** Σ (S_ν − M)·r over its reach, Hz² */
  powerHz2: number;
  /** the reach: where the smoothed S_ν stands more than half the threshold (dB) above the model, Hz */
  spanHz: [number, number];
}

export interface SpectralFeatures {
  spurs: SpurLine[];
  bumps: SpectralBump[];
}

interface ResolvedSpurOptions {
  ratio: number;
  lowHz: number;
  highHz: number;
  mergeGapPoints: number;
  maxSpurs: number;
  /** main-lobe half width, bins */
  lobe: number;
}

/** Main-lobe half width (first zero) of each window, bins (Harris 1978). */
const MAIN_LOBE_BINS: Record<WindowName, number> = { hann: 2, 'blackman-harris': 4, 'flat-top': 5 };
/** a group is a line when S_p − B >= this × (S_p − M_p) */
const LINE_FRACTION = 0.75;
/** shoulders: from lobe + 1 to lobe + SHOULDER_SPAN local bins away from the peak */
const SHOULDER_SPAN = 4;

function resolveSpurOptions(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions): ResolvedSpurOptions {
  checkSpectrum(spectrum, 'findSpurs');
  for (const [name, v] of Object.entries({
    whiteHz2PerHz: model?.whiteHz2PerHz,
    flickerHz2: model?.flickerHz2,
    randomWalkHz3: model?.randomWalkHz3,
  })) {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
      throw new AnalysisInputError(`findSpurs: model.${name} must be a finite number >= 0, got ${v}`);
    }
  }
  if (model.whiteHz2PerHz + model.flickerHz2 + model.randomWalkHz3 <= 0) {
    throw new AnalysisInputError('findSpurs: the model is zero everywhere');
  }
  const thresholdDb = options.thresholdDb ?? 10;
  if (!Number.isFinite(thresholdDb) || thresholdDb <= 0) {
    throw new AnalysisInputError(`findSpurs: thresholdDb must be a positive number, got ${thresholdDb}`);
  }
  const f = spectrum.frequencyHz;
  let lowHz = 0;
  let highHz = f[f.length - 1];
  if (options.bandHz !== undefined) {
    const [lo, hi] = options.bandHz;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo < 0 || hi <= lo) {
      throw new AnalysisInputError(`findSpurs: bandHz must be [lo, hi] with 0 <= lo < hi, got [${lo}, ${hi}]`);
    }
    lowHz = lo;
    highHz = hi;
  }
  const mergeGapPoints = options.mergeGapPoints ?? 2;
  if (!Number.isInteger(mergeGapPoints) || mergeGapPoints < 1) {
    throw new AnalysisInputError(`findSpurs: mergeGapPoints must be a positive integer, got ${mergeGapPoints}`);
  }
  const maxSpurs = options.maxSpurs ?? 100;
  if (!Number.isInteger(maxSpurs) || maxSpurs < 1) {
    throw new AnalysisInputError(`findSpurs: maxSpurs must be a positive integer, got ${maxSpurs}`);
  }
  const named = (spectrum as Spectrum & { window?: unknown }).window;
  const window = typeof named === 'string' && named in MAIN_LOBE_BINS ? (named as WindowName) : (options.window ?? 'hann');
  if (!(window in MAIN_LOBE_BINS)) {
    throw new AnalysisInputError(`findSpurs: window must be one of ${Object.keys(MAIN_LOBE_BINS).join(', ')}, got ${String(window)}`);
  }
  return { ratio: Math.pow(10, thresholdDb / 10), lowHz, highHz, mergeGapPoints, maxSpurs, lobe: MAIN_LOBE_BINS[window] };
}

/** Frequency of the peak at i, refined by a parabola through ln S at i−1, i, i+1 on an even grid. */
function refinePeak(f: Float64Array, s: Float64Array, i: number): number {
  if (i === 0 || i === f.length - 1) return f[i];
  const h0 = f[i] - f[i - 1];
  const h1 = f[i + 1] - f[i];
  if (Math.abs(h0 - h1) > 1e-6 * h1 || !(s[i - 1] > 0 && s[i + 1] > 0 && s[i] > 0)) return f[i];
  const a = Math.log(s[i - 1]);
  const b = Math.log(s[i]);
  const c = Math.log(s[i + 1]);
  const den = a - 2 * b + c;
  if (!(den < 0)) return f[i];
  // vertex of the parabola through (−1, a), (0, b), (1, c): δ = (a − c) / (2(a − 2b + c)), |δ| <= ½
  const delta = (0.5 * (a - c)) / den;
  return f[i] + Math.max(-0.5, Math.min(0.5, delta)) * h1;
}

interface Group {
  first: number;
  last: number;
  peak: number;
  peakRatio: number;
}

export function findSpectralFeatures(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions = {}): SpectralFeatures {
  const o = resolveSpurOptions(spectrum, model, options);
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const n = f.length;
  const extra = spectrum as Spectrum & { resolutionHz?: unknown; stage?: unknown };
  const resolution = extra.resolutionHz instanceof Float64Array && extra.resolutionHz.length === n ? extra.resolutionHz : null;
  const stage = extra.stage instanceof Uint8Array && extra.stage.length === n ? extra.stage : null;
  // the band's index range, the model on it and the local resolution
  let lo = 0;
  while (lo < n && !(f[lo] > 0 && f[lo] >= o.lowHz)) lo++;
  let hi = n - 1;
  while (hi >= lo && f[hi] > o.highHz) hi--;
  if (hi < lo) return { spurs: [], bumps: [] };
  const m = new Float64Array(n);
  for (let i = lo; i <= hi; i++) m[i] = evaluateNoiseModel(model, f[i]);
  const step = (i: number): number => {
    if (resolution) return resolution[i];
    const left = i > 0 ? f[i] - f[i - 1] : Infinity;
    const right = i + 1 < n ? f[i + 1] - f[i] : Infinity;
    const v = Math.min(left, right);
    return Number.isFinite(v) ? v : f[i];
  };

  // candidate groups
  const groups: Group[] = [];
  let current: Group | null = null;
  for (let i = lo; i <= hi; i++) {
    const ratio = s[i] / m[i];
    if (!(ratio > o.ratio)) continue;
    if (current && i - current.last > o.mergeGapPoints) {
      groups.push(current);
      current = null;
    }
    if (!current) current = { first: i, last: i, peak: i, peakRatio: ratio };
    current.last = i;
    if (ratio > current.peakRatio) {
      current.peak = i;
      current.peakRatio = ratio;
    }
  }
  if (current) groups.push(current);
  groups.sort((p, q) => q.peakRatio - p.peakRatio);

  // smoothed excess (running mean of S − M over ±(lobe + 1) points of the band), from prefix sums
  const half = o.lobe + 1;
  const prefix = new Float64Array(hi - lo + 2);
  for (let i = lo; i <= hi; i++) prefix[i - lo + 1] = prefix[i - lo] + (s[i] - m[i]);
  const smooth = (i: number): number => {
    const a = Math.max(lo, i - half);
    const b = Math.min(hi, i + half);
    return (prefix[b - lo + 1] - prefix[a - lo]) / (b - a + 1);
  };

  const spurs: SpurLine[] = [];
  const bumps: SpectralBump[] = [];
  const absorbed: [number, number][] = [];
  for (const g of groups) {
    const p = g.peak;
    if (absorbed.some(([a, b]) => p >= a && p <= b)) continue;
    const r = step(p);
    // shoulders: mean S between lobe + 1 and lobe + SHOULDER_SPAN local bins on each side
    let shoulder = -Infinity;
    for (const dir of [-1, 1]) {
      let sum = 0;
      let count = 0;
      for (let i = p + dir; i >= lo && i <= hi; i += dir) {
        const d = Math.abs(f[i] - f[p]) / r;
        if (d > o.lobe + SHOULDER_SPAN + 1e-9) break;
        if (d >= o.lobe + 1 - 1e-9) {
          sum += s[i];
          count++;
        }
      }
      if (count > 0) shoulder = Math.max(shoulder, sum / count);
    }
    if (!Number.isFinite(shoulder)) shoulder = m[p];
    if (s[p] - shoulder >= LINE_FRACTION * (s[p] - m[p])) {
      // a line: its power over the main lobe (points of the peak's stage)
      let power = 0;
      for (let i = Math.max(lo, p - 4 * o.lobe); i <= Math.min(hi, p + 4 * o.lobe); i++) {
        if (stage && stage[i] !== stage[p]) continue;
        if (Math.abs(f[i] - f[p]) <= (o.lobe + 0.5) * r) power += (s[i] - m[i]) * step(i);
      }
      spurs.push({ frequencyHz: refinePeak(f, s, p), heightDb: 10 * Math.log10(g.peakRatio), powerHz2: power, resolutionHz: r });
      continue;
    }
    // a bump: smoothed maximum within the group, half-excess points, reach
    let top = p;
    let topValue = smooth(p);
    for (let i = g.first; i <= g.last; i++) {
      const v = smooth(i);
      if (v > topValue) {
        topValue = v;
        top = i;
      }
    }
    const halfCrossing = (dir: number): number => {
      let prev = top;
      for (let i = top + dir; i >= lo && i <= hi; i += dir) {
        const v = smooth(i);
        if (v < topValue / 2) {
          const vp = smooth(prev);
          return f[prev] + ((vp - topValue / 2) / (vp - v)) * (f[i] - f[prev]);
        }
        prev = i;
      }
      return f[prev];
    };
    const left = halfCrossing(-1);
    const right = halfCrossing(1);
    const reachRatio = Math.sqrt(o.ratio); // half the threshold, in dB
    let a = top;
    while (a - 1 >= lo && smooth(a - 1) + m[a - 1] > reachRatio * m[a - 1]) a--;
    let b = top;
    while (b + 1 <= hi && smooth(b + 1) + m[b + 1] > reachRatio * m[b + 1]) b++;
    a = Math.min(a, g.first);
    b = Math.max(b, g.last);
    absorbed.push([a, b]);
    let power = 0;
    for (let i = a; i <= b; i++) power += (s[i] - m[i]) * step(i);
    bumps.push({
      centerHz: 0.5 * (left + right),
      widthHz: right - left,
      heightDb: 10 * Math.log10((topValue + m[top]) / m[top]),
      powerHz2: power,
      spanHz: [f[a], f[b]],
    });
  }
  let kept = spurs;
  if (kept.length > o.maxSpurs) kept = [...kept].sort((p, q) => q.heightDb - p.heightDb).slice(0, o.maxSpurs);
  kept.sort((p, q) => p.frequencyHz - q.frequencyHz);
  bumps.sort((p, q) => p.centerHz - q.centerHz);
  return { spurs: kept, bumps };
}

/** The narrow lines only (see findSpectralFeatures). */
export function findSpurs(spectrum: Spectrum, model: NoiseModelCoefficients, options: SpurOptions = {}): SpurLine[] {
  return findSpectralFeatures(spectrum, model, options).spurs;
}

/**
 * A copy of a Welch-binned spectrum with each line's footprint taken out: every point within
 * (h + ½)·r of a line (r its own resolution, h the window's main-lobe half width, as above) is replaced by
 * the straight line between the nearest points outside the footprints. A cascade sees a line in every
 * stage, and the stitched spectrum can show its leakage in two stages at once near a stage boundary; the
 * figures that integrate S_ν (β-line, lineshape) then take the line back as one block of its measured
 * power (`addLineBlocks`), so it is counted once. Other fields of the spectrum are kept as they are.
 */
export function removeLines<T extends Spectrum>(spectrum: T, lines: readonly { frequencyHz: number }[], options: { window?: WindowName } = {}): T {
  checkSpectrum(spectrum, 'removeLines');
  const f = spectrum.frequencyHz;
  const n = f.length;
  const named = (spectrum as Spectrum & { window?: unknown }).window;
  const window = typeof named === 'string' && named in MAIN_LOBE_BINS ? (named as WindowName) : (options.window ?? 'hann');
  const lobe = MAIN_LOBE_BINS[window] ?? 2;
  const extra = spectrum as Spectrum & { resolutionHz?: unknown };
  const resolution = extra.resolutionHz instanceof Float64Array && extra.resolutionHz.length === n ? extra.resolutionHz : null;
  const step = (i: number): number => {
    if (resolution) return resolution[i];
    const left = i > 0 ? f[i] - f[i - 1] : Infinity;
    const right = i + 1 < n ? f[i + 1] - f[i] : Infinity;
    return Math.min(left, right);
  };
  const out = Float64Array.from(spectrum.psd);
  const inside = new Uint8Array(n);
  for (const line of lines) {
    for (let i = 0; i < n; i++) if (Math.abs(f[i] - line.frequencyHz) <= (lobe + 0.5) * step(i)) inside[i] = 1;
  }
  for (let i = 0; i < n; ) {
    if (!inside[i]) {
      i++;
      continue;
    }
    let j = i;
    while (j + 1 < n && inside[j + 1]) j++;
    const a = i - 1;
    const b = j + 1;
    for (let k = i; k <= j; k++) {
      if (a >= 0 && b < n) out[k] = out[a] + ((out[b] - out[a]) * (f[k] - f[a])) / (f[b] - f[a]);
      else out[k] = a >= 0 ? out[a] : b < n ? out[b] : out[k];
    }
    i = j + 1;
  }
  return { ...spectrum, psd: out };
}

/**
 * The spectrum with each line added back as a block of height P/w over [f − w/2, f + w/2] (w = the
 * line's resolution, narrower where the grid ends closer), so an integral of S_ν read linearly between
 * points holds exactly its power P, and a β-line test compares P/w — the line's density at the analysis
 * resolution — with β(f). Grid points inside a block are dropped (the block's edges carry the background
 * there). Returns a plain Spectrum.
 */
export function addLineBlocks(spectrum: Spectrum, lines: readonly { frequencyHz: number; powerHz2: number; resolutionHz: number }[]): Spectrum {
  checkSpectrum(spectrum, 'addLineBlocks');
  const f = Array.from(spectrum.frequencyHz);
  const s = Array.from(spectrum.psd);
  for (const line of [...lines].sort((p, q) => p.frequencyHz - q.frequencyHz)) {
    // the block stays inside the grid: narrower near an end, still holding P
    const half = Math.min(line.resolutionHz / 2, 0.999 * (line.frequencyHz - f[0]), 0.999 * (f[f.length - 1] - line.frequencyHz));
    if (!(line.powerHz2 > 0) || !(half > 0)) continue;
    const w = 2 * half;
    const lo = line.frequencyHz - half;
    const hi = line.frequencyHz + half;
    const eps = 1e-6 * w;
    const level = (x: number) => {
      let j = 1;
      while (f[j] < x) j++;
      return s[j - 1] + ((s[j] - s[j - 1]) * (x - f[j - 1])) / (f[j] - f[j - 1]);
    };
    const bgLo = level(lo - eps);
    const bgHi = level(hi + eps);
    const top = line.powerHz2 / w;
    let first = 0;
    while (f[first] < lo - eps) first++;
    let last = first;
    while (last < f.length && f[last] <= hi + eps) last++;
    f.splice(first, last - first, lo - eps, lo, hi, hi + eps);
    s.splice(first, last - first, bgLo, bgLo + top, bgHi + top, bgHi);
  }
  return { frequencyHz: Float64Array.from(f), psd: Float64Array.from(s) };
}
