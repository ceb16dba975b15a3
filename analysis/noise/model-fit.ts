/**
 * Power-law noise model S_ν = a₀ + a₋₁/f + a₋₂/f² fitted to a frequency-noise PSD, and its 1/f corner.
 *
 * Usage:
 *   import { fitNoiseModel, evaluateNoiseModel } from '../analysis/noise/model-fit';
 *   const m = fitNoiseModel(logSpectrum);                          // whole band of the spectrum
 *   const m2 = fitNoiseModel(logSpectrum, { bandHz: [10, 1e5] });
 *   m.whiteHz2PerHz; m.flickerHz2; m.randomWalkHz3; m.cornerHz; m.notes; evaluateNoiseModel(m, 50)
 *
 * Model: white FM a₀ [Hz²/Hz], flicker FM a₋₁ [Hz²], random-walk FM a₋₂ [Hz³] — the laser form of the
 * power-law model of IEEE Std 1139-2008 and Barnes et al., "Characterization of frequency stability",
 * IEEE Trans. Instrum. Meas. IM-20, 105 (1971) (h_a = ν0²·h_a^(y)). Corner f_c = a₋₁/a₀.
 * Fit (Phaseloom METHODS 1.3, 3.2): each point is ≈ S·χ²_ν/ν with ν ≈ 2K_j (K_j the Welch segments
 * behind point j, summed over the merged bins of a log-binned point), relative variance ≈ c/K_j, so the
 * fit is least squares in the linear domain with weights K_j/S_model², iterated (iteratively reweighted
 * least squares — the quasi-likelihood fit of a gamma-distributed response with identity link,
 * McCullagh & Nelder, "Generalized Linear Models", 2nd ed. (1989), ch. 8). A spectrum without per-point
 * averages (a plain Spectrum) has K_j = 1. Each step solves the weighted problem exactly under a_k >= 0 by
 * trying every subset of the three terms (exact non-negative least squares for three unknowns), each by
 * its equilibrated normal equations (ml-matrix). Never fit dB values (METHODS 3.2).
 * Terms: a term is kept only when it lowers the weighted squared residual Σ K_j(S_j − M_j)²/M_j² by more
 * than c·ln(n) (n points used, c the variance scale below) — the Schwarz criterion (G. Schwarz,
 * "Estimating the dimension of a model", Ann. Stat. 6(2), 461–464 (1978)) on the quasi-likelihood, so a
 * few noisy low-frequency points do not buy a random-walk term that the spectrum does not hold.
 * Outliers above the model (our rule, stated here): a point is left out when
 *   S_j > M_j · max(10^(spurThresholdDb/10), 1 + outlierSigma·√(c/K_j)),
 * i.e. it stands both clearly (≥ 3 dB) and improbably (≥ 5 standard deviations) above the model — mains
 * lines, relaxation-oscillation and servo bumps, which the power law does not describe. c is the
 * variance scale: the squared robust spread 1.4826·MAD of (S_j/M_j − 1)·√K_j over the band, at least 1
 * when the points carry averages (K_eff ≤ K; merged Hann bins are correlated, so c is 1–2 in practice).
 * Start: one fit with weights K_j/S_j² (data), in which lines weigh almost nothing; then rounds of
 * (outlier set from the current model, reweighted fit to convergence) until the set stops changing.
 * Only points above the model are left out; points below it stay (a notch is not a spur).
 * Defaults: band = the whole spectrum above 0 Hz; spurThresholdDb 3; outlierSigma 5; at most 100
 * reweighting steps per round and 20 rounds; converged when no model value moves by more than 1e-10
 * relative. Memory and time are O(points) per step.
 * Worked check: S_ν = 10⁴ + 10⁶/f exactly → a₀ = 10⁴, a₋₁ = 10⁶, a₋₂ = 0, f_c = 100 Hz.
 */

import { Matrix, solve } from 'ml-matrix';

import { AnalysisInputError } from '../errors';
import type { NoiseModelFit, Spectrum } from '../types';
import { checkSpectrum, pointAverages } from '../linewidth/spectrum-grid';

export interface NoiseModelCoefficients {
  whiteHz2PerHz: number;
  flickerHz2: number;
  randomWalkHz3: number;
}

export interface NoiseModelFitOptions {
  /** band [lo, hi] Hz; default the whole spectrum above 0 Hz */
  bandHz?: [number, number];
  /** starting coefficients (first weights K/M²); default a first fit with weights K/S_data² */
  initial?: NoiseModelCoefficients;
  /** a point is left out only when it stands at least this many dB above the model; default 3 */
  spurThresholdDb?: number;
  /** … and at least this many standard deviations (√(c/K) relative); default 5 */
  outlierSigma?: number;
  /** iteration cap of the reweighting (per round); default 100 */
  maxIterations?: number;
}

/** The fit with what it left out, said as notes (informational) apart from the warnings. */
export interface NoiseModelFitResult extends NoiseModelFit {
  /** variance scale c: a point's relative variance is c/K_j */
  varianceScale: number;
  /** frequencies (Hz) of the points left out as standing above the model */
  excludedHz: number[];
  notes: string[];
}

interface ResolvedNoiseModelFitOptions {
  lowHz: number;
  highHz: number;
  initial: NoiseModelCoefficients | null;
  spurRatio: number;
  outlierSigma: number;
  maxIterations: number;
}

const TERMS = 3;
const CONVERGED = 1e-10;
const MAX_SPUR_ROUNDS = 20;
/** more than this fraction of the band left out: the power law does not describe the spectrum */
const EXCLUDED_WARNING_FRACTION = 0.25;
/** MAD → standard deviation of a normal distribution */
const MAD_TO_SD = 1.4826;

/** S_ν(f) of a model, Hz²/Hz. */
export function evaluateNoiseModel(model: NoiseModelCoefficients, frequencyHz: number): number {
  return model.whiteHz2PerHz + model.flickerHz2 / frequencyHz + model.randomWalkHz3 / (frequencyHz * frequencyHz);
}

function resolveNoiseModelFitOptions(spectrum: Spectrum, options: NoiseModelFitOptions): ResolvedNoiseModelFitOptions {
  checkSpectrum(spectrum, 'fitNoiseModel');
  const f = spectrum.frequencyHz;
  let lowHz = f[0] > 0 ? f[0] : f[1];
  let highHz = f[f.length - 1];
  if (options.bandHz !== undefined) {
    const [lo, hi] = options.bandHz;
    if (!Number.isFinite(lo) || !Number.isFinite(hi) || lo <= 0 || hi <= lo) {
      throw new AnalysisInputError(`fitNoiseModel: bandHz must be [lo, hi] with 0 < lo < hi, got [${lo}, ${hi}]`);
    }
    lowHz = lo;
    highHz = hi;
  }
  const initial = options.initial ?? null;
  if (initial !== null) {
    for (const [name, v] of Object.entries(initial)) {
      if (!Number.isFinite(v) || v < 0) {
        throw new AnalysisInputError(`fitNoiseModel: initial.${name} must be a finite number >= 0, got ${v}`);
      }
    }
    if (initial.whiteHz2PerHz + initial.flickerHz2 + initial.randomWalkHz3 <= 0) {
      throw new AnalysisInputError('fitNoiseModel: the initial model must have at least one positive coefficient');
    }
  }
  const thresholdDb = options.spurThresholdDb ?? 3;
  if (!Number.isFinite(thresholdDb) || thresholdDb <= 0) {
    throw new AnalysisInputError(`fitNoiseModel: spurThresholdDb must be a positive number, got ${thresholdDb}`);
  }
  const outlierSigma = options.outlierSigma ?? 5;
  if (!(outlierSigma > 0)) {
    throw new AnalysisInputError(`fitNoiseModel: outlierSigma must be a positive number (Infinity keeps every point), got ${outlierSigma}`);
  }
  const maxIterations = options.maxIterations ?? 100;
  if (!Number.isInteger(maxIterations) || maxIterations < 1) {
    throw new AnalysisInputError(`fitNoiseModel: maxIterations must be a positive integer, got ${maxIterations}`);
  }
  return { lowHz, highHz, initial, spurRatio: Math.pow(10, thresholdDb / 10), outlierSigma, maxIterations };
}

/**
 * min Σ wᵢ(Sᵢ − Σ a_k φ_k(fᵢ))² + termPenalty·(terms used), a >= 0, wᵢ = Kᵢ/Mᵢ², over the points
 * with use[i]: every subset of the terms solved by least squares (normal equations, columns
 * equilibrated, solved with ml-matrix), the best feasible one kept.
 */
function weightedNonNegativeFit(
  f: Float64Array,
  s: Float64Array,
  k: Float64Array,
  model: Float64Array,
  use: Uint8Array,
  termPenalty: number,
): Float64Array {
  // weighted normal equations G a = b for all three terms, and Σ w S² for the cost
  const g = new Float64Array(TERMS * TERMS);
  const b = new Float64Array(TERMS);
  let ss = 0;
  const phi = new Float64Array(TERMS);
  for (let i = 0; i < f.length; i++) {
    if (!use[i]) continue;
    const w = k[i] / (model[i] * model[i]);
    phi[0] = 1;
    phi[1] = 1 / f[i];
    phi[2] = phi[1] * phi[1];
    for (let k = 0; k < TERMS; k++) {
      b[k] += w * phi[k] * s[i];
      for (let l = 0; l < TERMS; l++) g[k * TERMS + l] += w * phi[k] * phi[l];
    }
    ss += w * s[i] * s[i];
  }
  const best = new Float64Array(TERMS);
  let bestCost = Infinity;
  for (let mask = 1; mask < 1 << TERMS; mask++) {
    const cols: number[] = [];
    for (let k = 0; k < TERMS; k++) if (mask & (1 << k)) cols.push(k);
    const m = cols.length;
    // equilibrate: scale each column by 1/√G_kk
    const scale = cols.map((k) => 1 / Math.sqrt(g[k * TERMS + k]));
    if (scale.some((v) => !Number.isFinite(v))) continue;
    const a = new Matrix(m, m);
    const rhs = new Matrix(m, 1);
    for (let r = 0; r < m; r++) {
      rhs.set(r, 0, b[cols[r]] * scale[r]);
      for (let c = 0; c < m; c++) a.set(r, c, g[cols[r] * TERMS + cols[c]] * scale[r] * scale[c]);
    }
    let x: Matrix;
    try {
      x = solve(a, rhs);
    } catch {
      continue; // singular subset
    }
    const coef = new Float64Array(TERMS);
    let feasible = true;
    for (let r = 0; r < m; r++) {
      const v = x.get(r, 0) * scale[r];
      if (!(v >= 0) || !Number.isFinite(v)) feasible = false;
      coef[cols[r]] = v;
    }
    if (!feasible) continue;
    // cost = Σ w (S − Φa)² = Σ w S² − 2 aᵀb + aᵀ G a
    let cost = ss;
    for (let k = 0; k < TERMS; k++) {
      cost -= 2 * coef[k] * b[k];
      for (let l = 0; l < TERMS; l++) cost += coef[k] * g[k * TERMS + l] * coef[l];
    }
    cost += termPenalty * m;
    if (cost < bestCost) {
      bestCost = cost;
      best.set(coef);
    }
  }
  return best;
}

/** Median of a scratch array (sorted in place). */
function median(a: Float64Array): number {
  a.sort();
  const n = a.length;
  return n % 2 === 1 ? a[n >> 1] : 0.5 * (a[n / 2 - 1] + a[n / 2]);
}

/** Variance scale c: (1.4826·MAD of (S/M − 1)·√K)², at least 1 when the points carry averages. */
function varianceScale(s: Float64Array, k: Float64Array, model: Float64Array, hasAverages: boolean): number {
  const n = s.length;
  const r = new Float64Array(n);
  for (let i = 0; i < n; i++) r[i] = (s[i] / model[i] - 1) * Math.sqrt(k[i]);
  const mid = median(Float64Array.from(r));
  for (let i = 0; i < n; i++) r[i] = Math.abs(r[i] - mid);
  const sd = MAD_TO_SD * median(r);
  return hasAverages ? Math.max(1, sd * sd) : sd * sd;
}

export function fitNoiseModel(spectrum: Spectrum, options: NoiseModelFitOptions = {}): NoiseModelFitResult {
  const o = resolveNoiseModelFitOptions(spectrum, options);
  const warnings: string[] = [];
  const notes: string[] = [];
  const fAll = spectrum.frequencyHz;
  const sAll = spectrum.psd;
  const kAll = pointAverages(spectrum, 'fitNoiseModel');
  const picked: number[] = [];
  for (let i = 0; i < fAll.length; i++) if (fAll[i] > 0 && fAll[i] >= o.lowHz && fAll[i] <= o.highHz) picked.push(i);
  if (picked.length < TERMS + 1) {
    throw new AnalysisInputError(
      `fitNoiseModel: the band [${o.lowHz}, ${o.highHz}] Hz holds ${picked.length} points; at least ${TERMS + 1} are needed`,
    );
  }
  const n = picked.length;
  const f = new Float64Array(n);
  const s = new Float64Array(n);
  const k = new Float64Array(n);
  let mean = 0;
  for (let r = 0; r < n; r++) {
    f[r] = fAll[picked[r]];
    s[r] = sAll[picked[r]];
    k[r] = kAll ? kAll[picked[r]] : 1;
    mean += s[r] / n;
  }
  if (!(mean > 0)) throw new AnalysisInputError('fitNoiseModel: S_ν is zero everywhere in the band');
  const floor = mean * 1e-12;

  const model = new Float64Array(n);
  const modelOf = (c: Float64Array, i: number) => c[0] + c[1] / f[i] + c[2] / (f[i] * f[i]);
  const use = new Uint8Array(n).fill(1);
  let coef: Float64Array;
  let iterations = 0;
  if (o.initial) {
    coef = Float64Array.of(o.initial.whiteHz2PerHz, o.initial.flickerHz2, o.initial.randomWalkHz3);
  } else {
    // start: weights K/S² from the data — points far above (lines) weigh almost nothing
    for (let i = 0; i < n; i++) model[i] = Math.max(s[i], floor);
    coef = weightedNonNegativeFit(f, s, k, model, use, 0);
    iterations++;
  }
  for (let i = 0; i < n; i++) model[i] = Math.max(modelOf(coef, i), floor);

  // outlier set from the current model: S > M·max(ratio, 1 + z·√(c/K))
  let scale = varianceScale(s, k, model, kAll !== null);
  const outliers = (): { set: Uint8Array; count: number } => {
    const set = new Uint8Array(n);
    let count = 0;
    for (let i = 0; i < n; i++) {
      const limit = Math.max(o.spurRatio, 1 + o.outlierSigma * Math.sqrt(scale / k[i]));
      if (s[i] > limit * model[i]) {
        set[i] = 1;
        count++;
      }
    }
    return { set, count };
  };
  let excluded = 0;
  let converged = false;
  let settled = false;
  for (let round = 0; round < MAX_SPUR_ROUNDS; round++) {
    const { set, count } = outliers();
    let changed = round === 0;
    for (let i = 0; i < n; i++) {
      if (set[i] === use[i]) changed = true; // use = 1 − outlier
      use[i] = 1 - set[i];
    }
    excluded = count;
    if (!changed) {
      settled = true;
      break;
    }
    if (n - count < TERMS + 1) break;
    converged = false;
    for (let it = 0; it < o.maxIterations; it++) {
      iterations++;
      coef = weightedNonNegativeFit(f, s, k, model, use, scale * Math.log(n - count));
      // reweight with the new model: wᵢ = Kᵢ/Mᵢ²
      let change = 0;
      for (let i = 0; i < n; i++) {
        const m = Math.max(modelOf(coef, i), floor);
        change = Math.max(change, Math.abs(m - model[i]) / model[i]);
        model[i] = m;
      }
      if (change < CONVERGED) {
        converged = true;
        break;
      }
    }
    scale = varianceScale(s, k, model, kAll !== null);
  }
  if (!converged) warnings.push(`the reweighted fit did not settle within ${o.maxIterations} steps`);
  if (!settled) warnings.push(`the set of points left out above the model kept changing for ${MAX_SPUR_ROUNDS} rounds`);
  const excludedHz: number[] = [];
  for (let i = 0; i < n; i++) if (!use[i]) excludedHz.push(f[i]);
  if (excluded > 0) {
    const text =
      `${excluded} point(s) standing more than ${(10 * Math.log10(o.spurRatio)).toFixed(1)} dB and ` +
      `${o.outlierSigma} standard deviations above the model were left out as spurs or bumps`;
    if (excluded > EXCLUDED_WARNING_FRACTION * n) {
      warnings.push(`${text} — ${Math.round((100 * excluded) / n)} % of the band: the power-law model does not describe this spectrum well`);
    } else {
      notes.push(text);
    }
  }
  let chi = 0;
  let used = 0;
  for (let i = 0; i < n; i++) {
    if (!use[i]) continue;
    const e = (s[i] - model[i]) / model[i];
    chi += e * e;
    used++;
  }
  const active = (coef[0] > 0 ? 1 : 0) + (coef[1] > 0 ? 1 : 0) + (coef[2] > 0 ? 1 : 0);
  if (used - active < 3) warnings.push(`only ${used} points in the band: the coefficients are poorly determined`);
  const [white, flicker, randomWalk] = coef;
  return {
    whiteHz2PerHz: white,
    flickerHz2: flicker,
    randomWalkHz3: randomWalk,
    // 1/f corner: a₋₁/f_c = a₀
    cornerHz: white > 0 && flicker > 0 ? flicker / white : null,
    bandHz: [f[0], f[n - 1]],
    pointCount: used,
    excludedCount: excluded,
    iterations,
    reducedChiSquare: used > active ? chi / (used - active) : 0,
    varianceScale: scale,
    excludedHz,
    warnings,
    notes,
  };
}
