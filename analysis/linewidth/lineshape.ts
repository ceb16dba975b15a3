/**
 * Optical lineshape and its FWHM from the whole measured S_ν (Elliott, Roy, Smith 1982).
 *
 * Usage:
 *   import { lineshape } from '../analysis/linewidth/lineshape';
 *   const r = lineshape(spectrum, { observationTimeS: 1e-2, tailLevelHz2PerHz: floor.valueHz2PerHz });
 *   r.fwhmHz (null when carrier-dominated); r.offsetHz / r.power (sampled line, power 1 at 0); r.warnings
 *
 * Method: D. S. Elliott, R. Roy, S. J. Smith, "Extracavity laser band-shape and bandwidth modification",
 * Phys. Rev. A 26, 12–18 (1982), for Gaussian phase noise and one-sided S_ν [Hz²/Hz]:
 *   Γ(τ)   = exp(−2 ∫_{1/T0}^∞ S_ν(f) sin²(πfτ)/f² df)        (field autocorrelation, Γ(0) = 1)
 *   S_E(ν) = 2 ∫₀^∞ Γ(τ) cos(2πντ) dτ                           (line centred at 0)
 * with the sharp cut at 1/T0 modelling a finite observation time T0 (as in Di Domenico, Schilt,
 * Thomann, Appl. Opt. 49(25), 4801 (2010)). Steps (Phaseloom METHODS 3.5):
 *  1. S_ν is read between grid points as the power law through them (segments wider than a ratio
 *     1.025 are subdivided) — or, with `interpolation: 'linear'` (estimated spectra, whose bins keep
 *     their ∫S df that way, so spectral lines keep their power; spectrum-grid.ts), as straight lines
 *     between the grid points — and on each piece as a straight line α + s·f, for which the f-integral is
 *     exact: ∫ sin²(af)/f² df = a·g(2af), ∫ sin²(af)/f df = Cin(2af)/2, with a = πτ,
 *     g(x) = Si(x) − (1 − cos x)/x (see sine-cosine-integrals.ts). No sampling of the oscillation.
 *  2. Above the top of the band a white tail of level h_t is added in closed form:
 *     ∫_{fmax}^∞ h_t sin²(af)/f² df = h_t·a·(π/2 − g(2a·fmax))      (METHODS 3.1 with f1 = fmax).
 *  3. Carrier floor: Γ(∞) = exp(−∫_{1/T0}^∞ S_ν/f² df). When Γ(∞) > 1e-3 the line is a coherent
 *     carrier plus a pedestal and has no meaningful FWHM: fwhmHz = null, carrierDominated = true.
 *     Otherwise Γ(∞) (the δ at ν = 0) is subtracted before the transform.
 *  4. τ grid chosen adaptively: τ½ where Γ = ½ by bracketing + Brent; step τ½/12; extended until
 *     Γ − Γ(∞) < 1e-10 (at most 4000 steps). S_E by Simpson's rule on that grid.
 *  5. FWHM = 2ν½ where S_E(ν½) = S_E(0)/2: first downward crossing by stepping ν, then Brent.
 * Low end (spectrum-grid.ts): when the first point f1 lies within 2.1/T0 (a log-frequency cascade's
 * lowest point lies between 1/T0 and ≈ 2/T0 for T0 = the record length) S_ν is taken flat at that
 * point's level from f1 down to 1/T0 (exact for white noise, slightly low for flicker) and `notes` says
 * so; further above 1/T0 the integral starts at f1 with a warning (the FWHM is then a lower bound).
 * Cost: (grid points) × (τ points) evaluations of Si/Ci — tens of ms for a 2000-point log spectrum;
 * grids with more than 8000 points in the band (long linear Welch spectra) are first averaged onto
 * 1000 log bins per decade (with a warning). Pass the log-frequency spectrum when there is one.
 * Defaults: maxHz = top grid frequency; interpolation 'power-law'; tail level = mean S_ν of the last 5 points used;
 * 129 display points from 0 to 4 FWHM.
 * Worked check: white S_ν = 10⁴ Hz²/Hz (T0 → ∞) gives a Lorentzian with FWHM = π·10⁴ = 31415.93 Hz.
 */

import { AnalysisInputError } from '../errors';
import type { LineshapeResult, Spectrum } from '../types';
import { brentRoot } from './brent-root';
import { sineCosineIntegrals } from './sine-cosine-integrals';
import { checkSpectrum, firstIndexAtOrAbove, lowEnd, psdAt, psdFlatBelow } from './spectrum-grid';

/** The lineshape with the documented approximations that applied (`notes`, not problems). */
export interface LineshapeReport extends LineshapeResult {
  notes: string[];
}

export interface LineshapeOptions {
  /** observation time T0 (s): S_ν is cut off below 1/T0 */
  observationTimeS: number;
  /** top of the trusted band, Hz; default the top grid frequency */
  maxHz?: number;
  /** white level appended analytically above maxHz, Hz²/Hz; default the mean S_ν of the last 5 points used */
  tailLevelHz2PerHz?: number;
  /** reading between points: 'power-law' (default; exact for analytic power laws) or 'linear' (for
   *  estimated spectra: keeps each bin's ∫S df, so spectral lines keep their power — spectrum-grid.ts) */
  interpolation?: 'power-law' | 'linear';
  /** number of samples of the displayed line; default 129 */
  displayPoints?: number;
  /** displayed offsets run from 0 to this many FWHM; default 4 */
  displaySpanFwhm?: number;
}

interface ResolvedLineshapeOptions {
  observationTimeS: number;
  lowHz: number;
  maxHz: number;
  tailLevelHz2PerHz: number;
  displayPoints: number;
  displaySpanFwhm: number;
  firstIndex: number;
  linear: boolean;
  warnings: string[];
  notes: string[];
}

/** Carrier floor above which the line is reported as carrier-dominated (METHODS 3.5). */
const CARRIER_FLOOR_LIMIT = 1e-3;
/** Γ − Γ(∞) level at which the τ grid stops. */
const GAMMA_END = 1e-10;
const TAU_STEPS_PER_HALF = 12;
const MAX_TAU_POINTS = 4001;
/** largest ratio f_{i+1}/f_i kept as one linear piece (power-law segments are subdivided below it) */
const MAX_SEGMENT_RATIO = 1.025;
const MAX_NODES = 40_000;
/** grids denser than this inside the band are averaged onto log bins first (cost is nodes × τ points) */
const MAX_GRID_POINTS = 8000;
const THIN_BINS_PER_DECADE = 1000;
const TAIL_POINTS = 5;

function resolveLineshapeOptions(spectrum: Spectrum, options: LineshapeOptions): ResolvedLineshapeOptions {
  checkSpectrum(spectrum, 'lineshape');
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const warnings: string[] = [];
  const t0 = options.observationTimeS;
  if (typeof t0 !== 'number' || !Number.isFinite(t0) || t0 <= 0) {
    throw new AnalysisInputError(`lineshape: observationTimeS must be a positive finite number, got ${t0}`);
  }
  const top = f[f.length - 1];
  const maxHz = options.maxHz ?? top;
  if (!Number.isFinite(maxHz) || maxHz <= 0 || maxHz > top) {
    throw new AnalysisInputError(`lineshape: maxHz must be in (0, ${top}] (the top of the grid), got ${maxHz}`);
  }
  const notes: string[] = [];
  const low = lowEnd(spectrum, 1 / t0);
  if (low.note) notes.push(low.note);
  else if (low.startHz > 1 / t0) {
    warnings.push(
      `the spectrum starts at ${low.firstHz} Hz, above 1/T0 = ${1 / t0} Hz: noise between them is left out (the FWHM is a lower bound)`,
    );
  }
  const lowHz = low.startHz;
  if (lowHz >= maxHz) {
    throw new AnalysisInputError(`lineshape: 1/T0 = ${1 / t0} Hz must lie below the top of the band, ${maxHz} Hz`);
  }
  let tail = options.tailLevelHz2PerHz;
  if (tail === undefined) {
    // mean of the last points at or below maxHz
    const j = firstIndexAtOrAbove(f, maxHz);
    const end = j < f.length && f[j] === maxHz ? j : j - 1;
    let sum = 0;
    let n = 0;
    for (let i = end; i >= 0 && n < TAIL_POINTS && f[i] >= lowHz; i--, n++) sum += s[i];
    tail = n > 0 ? sum / n : psdAt(f, s, maxHz);
  }
  if (!Number.isFinite(tail) || tail < 0) {
    throw new AnalysisInputError(`lineshape: tailLevelHz2PerHz must be a finite number >= 0, got ${tail}`);
  }
  const interpolation = options.interpolation ?? 'power-law';
  if (interpolation !== 'power-law' && interpolation !== 'linear') {
    throw new AnalysisInputError(`lineshape: interpolation must be 'power-law' or 'linear', got ${String(interpolation)}`);
  }
  const displayPoints = options.displayPoints ?? 129;
  if (!Number.isInteger(displayPoints) || displayPoints < 2 || displayPoints > 10_000) {
    throw new AnalysisInputError(`lineshape: displayPoints must be an integer in [2, 10000], got ${displayPoints}`);
  }
  const displaySpanFwhm = options.displaySpanFwhm ?? 4;
  if (!Number.isFinite(displaySpanFwhm) || displaySpanFwhm <= 0 || displaySpanFwhm > 20) {
    throw new AnalysisInputError(`lineshape: displaySpanFwhm must be in (0, 20], got ${displaySpanFwhm}`);
  }
  return {
    observationTimeS: t0,
    lowHz,
    maxHz,
    tailLevelHz2PerHz: tail,
    displayPoints,
    displaySpanFwhm,
    firstIndex: low.firstIndex,
    linear: interpolation === 'linear',
    warnings,
    notes,
  };
}

/**
 * Nodes of the piecewise-linear S_ν on [lowHz, maxHz]: grid points strictly inside, the two ends
 * interpolated, and wide power-law segments subdivided.
 */
function buildNodes(
  spectrum: Spectrum,
  lowHz: number,
  maxHz: number,
  firstIndex: number,
  linear: boolean,
): { nodeHz: Float64Array; nodePsd: Float64Array; thinnedFrom: number } {
  let f = spectrum.frequencyHz;
  let s = spectrum.psd;
  const inside = firstIndexAtOrAbove(f, maxHz) - firstIndexAtOrAbove(f, lowHz);
  let thinnedFrom = 0;
  if (inside > MAX_GRID_POINTS) {
    ({ f, s } = thinGrid(f, s, lowHz, maxHz));
    thinnedFrom = inside;
  }
  const base: number[] = [lowHz];
  for (let i = firstIndexAtOrAbove(f, lowHz); i < f.length && f[i] < maxHz; i++) {
    if (f[i] > lowHz) base.push(f[i]);
  }
  base.push(maxHz);
  // linear reading: the grid points are the nodes; power law: wide segments subdivided
  const maxLogStep = linear ? Infinity : Math.log(MAX_SEGMENT_RATIO);
  let total = 1;
  for (let i = 0; i + 1 < base.length; i++) total += Math.max(1, Math.ceil(Math.log(base[i + 1] / base[i]) / maxLogStep));
  const shrink = total > MAX_NODES ? total / MAX_NODES : 1;
  const nodes: number[] = [base[0]];
  for (let i = 0; i + 1 < base.length; i++) {
    const steps = Math.max(1, Math.floor(Math.ceil(Math.log(base[i + 1] / base[i]) / maxLogStep) / shrink));
    const ratio = base[i + 1] / base[i];
    for (let k = 1; k < steps; k++) nodes.push(base[i] * Math.pow(ratio, k / steps));
    nodes.push(base[i + 1]);
  }
  const nodeHz = Float64Array.from(nodes);
  const nodePsd = new Float64Array(nodeHz.length);
  // flat at the first positive point's level below it (low-end rule); a thinned grid keeps that point
  const first = thinnedFrom > 0 ? (f[0] > 0 ? 0 : 1) : firstIndex;
  for (let j = 0; j < nodeHz.length; j++) nodePsd[j] = psdFlatBelow(f, s, first, nodeHz[j], linear);
  return { nodeHz, nodePsd, thinnedFrom };
}

/**
 * A very dense grid (a long linear Welch spectrum) averaged onto log bins of 1/THIN_BINS_PER_DECADE
 * decade: mean f and mean S per bin, which keeps ∫S df of each bin (spur power is kept, its shape
 * is smoothed). The points bracketing lowHz and maxHz are kept as they are.
 */
function thinGrid(f: Float64Array, s: Float64Array, lowHz: number, maxHz: number): { f: Float64Array; s: Float64Array } {
  const first = Math.max(0, firstIndexAtOrAbove(f, lowHz) - 1);
  const last = Math.min(f.length - 1, firstIndexAtOrAbove(f, maxHz));
  const outF: number[] = [f[first]];
  const outS: number[] = [s[first]];
  let key = Number.NaN;
  let sumF = 0;
  let sumS = 0;
  let count = 0;
  const flush = () => {
    if (count > 0) {
      outF.push(sumF / count);
      outS.push(sumS / count);
    }
    sumF = 0;
    sumS = 0;
    count = 0;
  };
  for (let i = first + 1; i < last; i++) {
    const k = Math.floor(Math.log10(f[i]) * THIN_BINS_PER_DECADE);
    if (k !== key) {
      flush();
      key = k;
    }
    sumF += f[i];
    sumS += s[i];
    count++;
  }
  flush();
  if (last > first) {
    outF.push(f[last]);
    outS.push(s[last]);
  }
  return { f: Float64Array.from(outF), s: Float64Array.from(outS) };
}

/** Evaluates D(τ)/2 = 2∫ S_ν sin²(πfτ)/f² df (+ white tail) for the piecewise-linear nodes. */
class PhaseStructure {
  private readonly nodeHz: Float64Array;
  /** per-node weight of g: α_{j−1} − α_j (α = intercept of the linear piece) */
  private readonly weightG: Float64Array;
  /** per-node weight of Cin: s_{j−1} − s_j (s = slope of the linear piece) */
  private readonly weightCin: Float64Array;
  private readonly tail: number;
  private readonly out = { si: 0, cin: 0, g: 0 };
  /** D(∞)/2 = ∫ S_ν/f² df from 1/T0 to ∞ */
  readonly limit: number;

  constructor(nodeHz: Float64Array, nodePsd: Float64Array, tail: number) {
    const n = nodeHz.length;
    this.nodeHz = nodeHz;
    this.tail = tail;
    this.weightG = new Float64Array(n);
    this.weightCin = new Float64Array(n);
    let limit = 0;
    for (let i = 0; i + 1 < n; i++) {
      const f0 = nodeHz[i];
      const f1 = nodeHz[i + 1];
      const slope = (nodePsd[i + 1] - nodePsd[i]) / (f1 - f0);
      const intercept = nodePsd[i] - slope * f0;
      // segment i contributes α(g(x_{i+1}) − g(x_i))·a + s(Cin(x_{i+1}) − Cin(x_i))/2
      this.weightG[i + 1] += intercept;
      this.weightG[i] -= intercept;
      this.weightCin[i + 1] += slope;
      this.weightCin[i] -= slope;
      // ∫ (α + s f)/f² df = α(1/f0 − 1/f1) + s ln(f1/f0)
      limit += intercept * (1 / f0 - 1 / f1) + slope * Math.log(f1 / f0);
    }
    this.limit = limit + tail / nodeHz[n - 1];
  }

  /** D(τ)/2 */
  halfStructure(tau: number): number {
    const a = Math.PI * tau;
    const n = this.nodeHz.length;
    const out = this.out;
    let sumG = 0;
    let sumCin = 0;
    for (let j = 0; j < n; j++) {
      sineCosineIntegrals(2 * a * this.nodeHz[j], out);
      sumG += this.weightG[j] * out.g;
      sumCin += this.weightCin[j] * out.cin;
    }
    // white tail above the last node: h_t·a·(π/2 − g(x_max)); `out` still holds the last node
    const tailPart = this.tail * a * (Math.PI / 2 - out.g);
    // D/2 = 2 ∫ S sin²/f² = 2 [a·Σ α Δg + Σ s ΔCin/2 + tail]
    return 2 * (a * sumG + 0.5 * sumCin + tailPart);
  }
}

const EMPTY = new Float64Array(0);

export function lineshape(spectrum: Spectrum, options: LineshapeOptions): LineshapeReport {
  const o = resolveLineshapeOptions(spectrum, options);
  const warnings = o.warnings;
  const { nodeHz, nodePsd, thinnedFrom } = buildNodes(spectrum, o.lowHz, o.maxHz, o.firstIndex, o.linear);
  if (thinnedFrom > 0) {
    warnings.push(
      `the ${thinnedFrom} grid points in the band were averaged onto ${THIN_BINS_PER_DECADE} log bins per decade (${nodeHz.length} nodes) to bound the work`,
    );
  }
  const structure = new PhaseStructure(nodeHz, nodePsd, o.tailLevelHz2PerHz);
  const carrierFraction = Math.exp(-structure.limit);
  const base = {
    observationTimeS: o.observationTimeS,
    carrierFraction,
    tailLevelHz2PerHz: o.tailLevelHz2PerHz,
    warnings,
    notes: o.notes,
  };
  if (carrierFraction > CARRIER_FLOOR_LIMIT) {
    warnings.push(
      `line dominated by a coherent carrier at this T0: ${(100 * carrierFraction).toPrecision(3)} % of the power stays in the carrier ` +
        `(∫ S_ν/f² df from 1/T0 = ${structure.limit.toPrecision(3)} rad²), so the FWHM is set by the observation time`,
    );
    return { fwhmHz: null, carrierDominated: true, offsetHz: EMPTY, power: EMPTY, ...base };
  }

  // τ½: Γ(τ½) = ½ ⇔ D/2 = ln 2. Bracket by halving/doubling from 0.01/fmax, then Brent.
  const target = Math.LN2;
  const excess = (tau: number) => structure.halfStructure(tau) - target;
  let hi = 0.01 / o.maxHz;
  let lo = 0;
  for (let k = 0; k < 200 && excess(hi) < 0; k++) {
    lo = hi;
    hi *= 2;
  }
  if (lo === 0) {
    for (let k = 0; k < 200; k++) {
      const half = hi / 2;
      if (excess(half) < 0) {
        lo = half;
        break;
      }
      hi = half;
    }
  }
  const tauHalf = brentRoot(excess, lo, hi, 1e-9 * hi);

  // Γ(τ) − Γ(∞) on a uniform grid, step τ½/12, until below 1e-10 (even number of intervals for Simpson).
  const step = tauHalf / TAU_STEPS_PER_HALF;
  const gamma: number[] = [1 - carrierFraction];
  let reachedEnd = false;
  while (gamma.length < MAX_TAU_POINTS) {
    const k = gamma.length;
    const value = Math.exp(-structure.halfStructure(k * step)) - carrierFraction;
    gamma.push(value);
    if (Math.abs(value) < GAMMA_END && k % 2 === 0) {
      reachedEnd = true;
      break;
    }
  }
  if (gamma.length % 2 === 0) gamma.pop();
  if (!reachedEnd) {
    warnings.push(
      `the field correlation had not decayed below ${GAMMA_END} at τ = ${((gamma.length - 1) * step).toPrecision(3)} s: the far wings of the line are approximate`,
    );
  }
  const g = Float64Array.from(gamma);
  const tauCount = g.length;
  // Simpson weights h/3·(1, 4, 2, 4, …, 4, 1), times 2 for S_E = 2∫
  const weights = new Float64Array(tauCount);
  for (let k = 0; k < tauCount; k++) {
    const w = k === 0 || k === tauCount - 1 ? 1 : k % 2 === 1 ? 4 : 2;
    weights[k] = ((2 * step) / 3) * w * g[k];
  }
  const fieldSpectrum = (nu: number): number => {
    // S_E(ν) = 2 ∫ (Γ − Γ∞) cos(2πντ) dτ
    const omegaStep = 2 * Math.PI * nu * step;
    let sum = 0;
    for (let k = 0; k < tauCount; k++) sum += weights[k] * Math.cos(omegaStep * k);
    return sum;
  };
  const peak = fieldSpectrum(0);
  const halfLevel = (nu: number) => fieldSpectrum(nu) - peak / 2;
  // first downward crossing of half maximum: step ν by 0.01/τ½ (a Lorentzian's half width is 0.11/τ½)
  const nuStep = 0.01 / tauHalf;
  const nuLimit = 0.5 / step; // Nyquist of the τ grid
  let nuLo = 0;
  let nuHi = nuStep;
  while (halfLevel(nuHi) > 0) {
    nuLo = nuHi;
    nuHi += nuStep;
    if (nuHi > nuLimit) {
      throw new AnalysisInputError('lineshape: the line never falls to half its maximum within the resolved band');
    }
  }
  const nuHalf = brentRoot(halfLevel, nuLo, nuHi, 1e-10 * nuHi);
  const fwhmHz = 2 * nuHalf; // full width: the line is symmetric about the carrier

  const count = o.displayPoints;
  const offsetHz = new Float64Array(count);
  const power = new Float64Array(count);
  const span = o.displaySpanFwhm * fwhmHz;
  for (let i = 0; i < count; i++) {
    offsetHz[i] = (span * i) / (count - 1);
    power[i] = fieldSpectrum(offsetHz[i]) / peak;
  }
  if (carrierFraction > 1e-8) {
    warnings.push(
      `a coherent carrier holds ${(100 * carrierFraction).toPrecision(3)} % of the power at this T0 (left out of the lineshape)`,
    );
  }
  return { fwhmHz, carrierDominated: false, offsetHz, power, ...base };
}
