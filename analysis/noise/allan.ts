/**
 * Allan deviation σ_y(τ) of a laser's frequency, overlapping (default) or non-overlapping, at
 * octave-spaced τ, with χ² confidence intervals and the noise type read off the local log-log slope.
 *
 * Usage:
 *   import { allanDeviation } from '../analysis/noise/allan';
 *   const r = allanDeviation({ phaseRad }, { sampleIntervalS: 1e-6, carrierFrequencyHz: 193.1e12 });
 *   r.points[0].tauS; r.points[0].deviation; r.points[0].interval; r.regions  // slopes to mark
 *   allanDeviation({ fractionalFrequency: y }, { sampleIntervalS: 1, averagingFactors: [1, 2] });
 *
 * Input (one of): phaseRad φ [rad] with the optical carrier ν0 [Hz] → phase-time x = φ/(2π ν0) [s];
 *   phaseTimeS x [s]; fractionalFrequency y = (ν − ν0)/ν0 [1], turned into x_0 = 0, x_i = τ0·Σ_{j≤i} y_j
 *   (N = M + 1 phase points). For a beat note use the beat phase and the optical ν0, not the IF.
 * Estimators (METHODS 5.3; W. J. Riley, "Handbook of Frequency Stability Analysis", NIST SP 1065 (2008);
 *   D. W. Allan, "Statistics of atomic frequency standards", Proc. IEEE 54, 221 (1966)):
 *   overlapping      σ_y²(τ) = Σ_{i=0}^{N−2m−1} (x_{i+2m} − 2x_{i+m} + x_i)² / (2 m² τ0² (N − 2m)),  τ = m τ0
 *   non-overlapping  the same sum over i = 0, m, 2m, … only (⌊(N−1)/m⌋ − 1 terms), = ½⟨(ȳ_{k+1} − ȳ_k)²⟩.
 * Confidence interval: σ² · edf/χ²_{(1±c)/2}(edf) (χ² distribution with the equivalent degrees of freedom).
 *   edf for the overlapping estimator: the "simple approximations" tabulated in NIST SP 1065 (after Howe,
 *   Allan, Barnes 1981) — formulas from memory, N = phase points, m = averaging factor:
 *     white PM    (N+1)(N−2m) / (2(N−m))
 *     flicker PM  exp(√(ln((N−1)/(2m)) · ln((2m+1)(N−1)/4)))
 *     white FM    [3(N−1)/(2m) − 2(N−2)/N] · 4m²/(4m²+5)
 *     flicker FM  m = 1: 2(N−2)²/(2.3N − 4.9);  m ≥ 2: 5N²/(4m(N+3m))
 *     RW FM       (N−2)/m · ((N−1)² − 3m(N−1) + 4m²)/(N−3)²
 *   Non-overlapping: edf = number of terms (our simple approximation, stated here; it treats the
 *   second differences as independent, which is nearly right for white FM and optimistic otherwise).
 *   edf below 1 (the last τ of a short record) is raised to 1.
 *   The χ² quantile is found by Brent's method on the regularised lower incomplete gamma function
 *   P(ν/2, x/2) (series and Lentz continued fraction, W. H. Press et al., "Numerical Recipes", 3rd ed.,
 *   Cambridge (2007), §6.2; ln Γ by the Lanczos approximation, C. Lanczos, SIAM J. Numer. Anal. B 1, 86 (1964)).
 * Noise type (for the edf in 'auto' mode and for marking): the local slope μ/2 = d ln σ_y/d ln τ, fitted
 *   over each point and its neighbours, is matched to the nearest power law of IEEE Std 1139-2008 /
 *   Barnes et al., IEEE Trans. Instrum. Meas. IM-20, 105 (1971): −1 PM (white or flicker: the Allan
 *   deviation cannot tell them apart), −½ white FM, 0 flicker FM, +½ random-walk FM (boundaries at the
 *   midpoints −¾, −¼, +¼). 'auto' uses the white-PM edf for 'pm'.
 * Defaults: overlapping; m = 1, 2, 4, … while N − 2m ≥ 1 (octave spacing); confidence 0.683 (±1σ);
 *   noiseType 'auto'.
 * Worked check: y = [892, 809, 823, 798, 671, 644, 883, 903, 677], τ0 = 1 → σ_y(1) = 91.22945,
 *   σ_y(2) = 85.95287 overlapping, 115.80821 non-overlapping (METHODS 5.3).
 */

import { AnalysisInputError } from '../errors';
import { brentRoot } from '../linewidth/brent-root';

export type AllanNoiseType = 'white-pm' | 'flicker-pm' | 'white-fm' | 'flicker-fm' | 'random-walk-fm';
/** what the local slope can tell: PM (−1), white FM (−½), flicker FM (0), random-walk FM (+½) */
export type AllanSlopeClass = 'pm' | 'white-fm' | 'flicker-fm' | 'random-walk-fm';
export type AllanEstimator = 'overlapping' | 'non-overlapping';

export type AllanInput =
  | { phaseRad: ArrayLike<number> }
  | { phaseTimeS: ArrayLike<number> }
  | { fractionalFrequency: ArrayLike<number> };

export interface AllanOptions {
  /** τ0, s */
  sampleIntervalS: number;
  /** ν0, Hz: needed with phaseRad (x = φ/(2π ν0)) */
  carrierFrequencyHz?: number;
  /** averaging factors m (τ = m τ0); default 1, 2, 4, … while N − 2m ≥ 1 */
  averagingFactors?: number[];
  estimator?: AllanEstimator;
  /** two-sided confidence level of the interval, in (0, 1); default 0.683 */
  confidence?: number;
  /** noise type behind the edf; default 'auto' (from the local slope) */
  noiseType?: AllanNoiseType | 'auto';
}

export interface ResolvedAllanOptions {
  sampleIntervalS: number;
  carrierFrequencyHz: number | null;
  averagingFactors: number[];
  estimator: AllanEstimator;
  confidence: number;
  noiseType: AllanNoiseType | 'auto';
}

export interface AllanPoint {
  averagingFactor: number;
  tauS: number;
  /** σ_y(τ) */
  deviation: number;
  /** σ_y²(τ) */
  variance: number;
  /** second differences summed */
  terms: number;
  /** equivalent degrees of freedom behind the interval */
  edf: number;
  /** noise type the edf was computed for */
  edfNoiseType: AllanNoiseType;
  /** [low, high] bounds of σ_y at the stated confidence */
  interval: [number, number];
  /** local log-log slope d ln σ_y / d ln τ (null with fewer than 2 points) */
  localSlope: number | null;
  slopeClass: AllanSlopeClass | null;
}

export interface AllanRegion {
  slopeClass: AllanSlopeClass;
  /** the power law's slope: −1, −½, 0 or +½ */
  referenceSlope: number;
  /** least-squares slope of ln σ_y on ln τ over the region (null for a one-point region) */
  fittedSlope: number | null;
  tauRangeS: [number, number];
}

export interface AllanResult {
  estimator: AllanEstimator;
  confidence: number;
  /** phase points N behind the estimate */
  phasePoints: number;
  points: AllanPoint[];
  /** runs of consecutive τ with the same slope class, for marking the plot */
  regions: AllanRegion[];
  warnings: string[];
}

const NOISE_TYPES: readonly AllanNoiseType[] = ['white-pm', 'flicker-pm', 'white-fm', 'flicker-fm', 'random-walk-fm'];
const REFERENCE_SLOPE: Record<AllanSlopeClass, number> = { pm: -1, 'white-fm': -0.5, 'flicker-fm': 0, 'random-walk-fm': 0.5 };
export const DEFAULT_CONFIDENCE = 0.683;

function phasePointsOf(input: AllanInput): number {
  if ('phaseRad' in input) return input.phaseRad.length;
  if ('phaseTimeS' in input) return input.phaseTimeS.length;
  return input.fractionalFrequency.length + 1;
}

/** Checks every option once; the core never sees undefined. */
export function resolveAllanOptions(input: AllanInput, options: AllanOptions): ResolvedAllanOptions {
  if (input === null || typeof input !== 'object' || !('phaseRad' in input || 'phaseTimeS' in input || 'fractionalFrequency' in input)) {
    throw new AnalysisInputError('allanDeviation: give one of phaseRad, phaseTimeS or fractionalFrequency');
  }
  const kinds = ['phaseRad', 'phaseTimeS', 'fractionalFrequency'].filter((k) => k in input);
  if (kinds.length !== 1) throw new AnalysisInputError(`allanDeviation: give exactly one record, got ${kinds.join(' and ')}`);
  const o = options ?? ({} as AllanOptions);
  const tau0 = o.sampleIntervalS;
  if (!(typeof tau0 === 'number' && Number.isFinite(tau0) && tau0 > 0)) {
    throw new AnalysisInputError(`sampleIntervalS must be a positive number of seconds, got ${String(tau0)}`);
  }
  let nu0: number | null = null;
  if ('phaseRad' in input) {
    nu0 = o.carrierFrequencyHz ?? NaN;
    if (!(Number.isFinite(nu0) && nu0 > 0)) {
      throw new AnalysisInputError(`a phase record needs carrierFrequencyHz (ν0 > 0) to form x = φ/(2πν0), got ${String(o.carrierFrequencyHz)}`);
    }
  } else if (o.carrierFrequencyHz !== undefined) {
    throw new AnalysisInputError('carrierFrequencyHz applies to phaseRad records only');
  }
  const n = phasePointsOf(input);
  if (n < 3) throw new AnalysisInputError(`the record needs at least 3 phase points (2 frequency values), got ${n}`);
  const estimator = o.estimator ?? 'overlapping';
  if (estimator !== 'overlapping' && estimator !== 'non-overlapping') {
    throw new AnalysisInputError(`estimator must be 'overlapping' or 'non-overlapping', got ${String(estimator)}`);
  }
  const confidence = o.confidence ?? DEFAULT_CONFIDENCE;
  if (!(typeof confidence === 'number' && confidence > 0 && confidence < 1)) {
    throw new AnalysisInputError(`confidence must lie in (0, 1), got ${String(confidence)}`);
  }
  const noiseType = o.noiseType ?? 'auto';
  if (noiseType !== 'auto' && !NOISE_TYPES.includes(noiseType)) {
    throw new AnalysisInputError(`noiseType must be 'auto' or one of ${NOISE_TYPES.join(', ')}, got ${String(noiseType)}`);
  }
  // the largest m with at least one second difference: overlapping N − 2m ≥ 1, non-overlapping 2m ≤ N − 1
  const mMax = Math.floor((n - 1) / 2);
  let factors: number[];
  if (o.averagingFactors === undefined) {
    factors = [];
    for (let m = 1; m <= mMax; m *= 2) factors.push(m);
  } else {
    if (!Array.isArray(o.averagingFactors) || o.averagingFactors.length === 0) {
      throw new AnalysisInputError('averagingFactors must be a non-empty array of integers');
    }
    factors = o.averagingFactors.slice();
    for (let i = 0; i < factors.length; i++) {
      const m = factors[i];
      if (!(Number.isInteger(m) && m >= 1 && m <= mMax)) {
        throw new AnalysisInputError(`averaging factors must be integers in [1, (N−1)/2 = ${mMax}], got ${m}`, `averagingFactors[${i}]`);
      }
      if (i > 0 && !(m > factors[i - 1])) {
        throw new AnalysisInputError(`averaging factors must increase, got ${factors[i - 1]} then ${m}`, `averagingFactors[${i}]`);
      }
    }
  }
  return { sampleIntervalS: tau0, carrierFrequencyHz: nu0, averagingFactors: factors, estimator, confidence, noiseType };
}

/** Phase-time x [s] from the input (a new array). */
function phaseTime(input: AllanInput, o: ResolvedAllanOptions): Float64Array {
  const check = (v: number, i: number) => {
    if (!Number.isFinite(v)) throw new AnalysisInputError(`the record holds a non-finite value ${v}`, `sample ${i}`);
  };
  if ('phaseRad' in input) {
    const p = input.phaseRad;
    const x = new Float64Array(p.length);
    const scale = 1 / (2 * Math.PI * (o.carrierFrequencyHz as number)); // x = φ/(2π ν0)
    for (let i = 0; i < p.length; i++) {
      check(p[i], i);
      x[i] = p[i] * scale;
    }
    return x;
  }
  if ('phaseTimeS' in input) {
    const p = input.phaseTimeS;
    const x = new Float64Array(p.length);
    for (let i = 0; i < p.length; i++) {
      check(p[i], i);
      x[i] = p[i];
    }
    return x;
  }
  const y = input.fractionalFrequency;
  const x = new Float64Array(y.length + 1);
  // x_0 = 0, x_i = τ0 Σ_{j<i} y_j (Kahan-compensated running sum)
  let sum = 0;
  let comp = 0;
  for (let i = 0; i < y.length; i++) {
    check(y[i], i);
    const t = y[i] * o.sampleIntervalS - comp;
    const s = sum + t;
    comp = s - sum - t;
    sum = s;
    x[i + 1] = sum;
  }
  return x;
}

/** σ_y²(m τ0) and the number of second differences summed. */
function allanVariance(x: Float64Array, m: number, tau0: number, step: number): { variance: number; terms: number } {
  const n = x.length;
  let sum = 0;
  let terms = 0;
  for (let i = 0; i + 2 * m < n; i += step) {
    const d = x[i + 2 * m] - 2 * x[i + m] + x[i]; // second difference of the phase-time
    sum += d * d;
    terms++;
  }
  // σ² = Σ d² / (2 m² τ0² · terms)
  return { variance: sum / (2 * m * m * tau0 * tau0 * terms), terms };
}

/** Equivalent degrees of freedom of the overlapping Allan variance (NIST SP 1065 simple approximations, from memory). */
export function overlappingAllanEdf(noiseType: AllanNoiseType, phasePoints: number, m: number): number {
  const N = phasePoints;
  let edf: number;
  switch (noiseType) {
    case 'white-pm':
      edf = ((N + 1) * (N - 2 * m)) / (2 * (N - m));
      break;
    case 'flicker-pm': {
      const a = Math.log((N - 1) / (2 * m));
      const b = Math.log(((2 * m + 1) * (N - 1)) / 4);
      edf = a > 0 && b > 0 ? Math.exp(Math.sqrt(a * b)) : 1;
      break;
    }
    case 'white-fm':
      edf = ((3 * (N - 1)) / (2 * m) - (2 * (N - 2)) / N) * ((4 * m * m) / (4 * m * m + 5));
      break;
    case 'flicker-fm':
      edf = m === 1 ? (2 * (N - 2) * (N - 2)) / (2.3 * N - 4.9) : (5 * N * N) / (4 * m * (N + 3 * m));
      break;
    case 'random-walk-fm':
      edf = ((N - 2) / m) * (((N - 1) * (N - 1) - 3 * m * (N - 1) + 4 * m * m) / ((N - 3) * (N - 3)));
      break;
  }
  return Number.isFinite(edf) && edf >= 1 ? edf : 1;
}

// ---- χ² quantiles (regularised incomplete gamma; Numerical Recipes 3rd ed. §6.1-6.2) ----

// the Numerical Recipes coefficients, written as the doubles they round to
const LANCZOS = [
  57.15623566586292, -59.59796035547549, 14.136097974741746, -0.4919138160976202, 3.399464998481189e-5, 4.652362892704858e-5,
  -9.837447530487956e-5, 1.580887032249125e-4, -2.1026444172410488e-4, 2.1743961811521265e-4, -1.643181065367639e-4,
  8.441822398385275e-5, -2.6190838401581408e-5, 3.6899182659531625e-6,
];

/** ln Γ(x), x > 0 (Lanczos, g = 607/128, 14 terms; relative error < 1e-15 — Numerical Recipes 3rd ed. §6.1). */
export function logGamma(x: number): number {
  let y = x;
  const tmp = x + 5.2421875; // x + g + ½ with g = 607/128
  const t = (x + 0.5) * Math.log(tmp) - tmp;
  let ser = 0.9999999999999971;
  for (let j = 0; j < 14; j++) ser += LANCZOS[j] / ++y;
  return t + Math.log((2.5066282746310007 * ser) / x); // √(2π)
}

/** Regularised lower incomplete gamma P(a, x). */
export function regularizedGammaP(a: number, x: number): number {
  if (x <= 0) return 0;
  const lnPre = -x + a * Math.log(x) - logGamma(a);
  if (x < a + 1) {
    // series Σ x^n / (a(a+1)…(a+n))
    let ap = a;
    let del = 1 / a;
    let sum = del;
    for (let n = 0; n < 10000; n++) {
      ap += 1;
      del *= x / ap;
      sum += del;
      if (Math.abs(del) < Math.abs(sum) * 1e-16) break;
    }
    return sum * Math.exp(lnPre);
  }
  // continued fraction for Q(a, x) by the modified Lentz method
  const tiny = 1e-300;
  let b = x + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 10000; i++) {
    const an = -i * (i - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return 1 - Math.exp(lnPre) * h;
}

/** The p-quantile of the χ² distribution with ν degrees of freedom (ν > 0, 0 < p < 1). */
export function chiSquareQuantile(p: number, dof: number): number {
  if (!(p > 0 && p < 1)) throw new AnalysisInputError(`chiSquareQuantile: p must lie in (0, 1), got ${p}`);
  if (!(dof > 0 && Number.isFinite(dof))) throw new AnalysisInputError(`chiSquareQuantile: the degrees of freedom must be > 0, got ${dof}`);
  const cdf = (x: number) => regularizedGammaP(dof / 2, x / 2) - p;
  let hi = Math.max(1, dof);
  while (cdf(hi) < 0) hi *= 2;
  let lo = hi / 2;
  while (lo > 1e-300 && cdf(lo) > 0) lo /= 4;
  if (cdf(lo) > 0) return lo;
  return brentRoot(cdf, lo, hi, 1e-15 * hi);
}

function classifySlope(slope: number): AllanSlopeClass {
  if (slope < -0.75) return 'pm';
  if (slope < -0.25) return 'white-fm';
  if (slope < 0.25) return 'flicker-fm';
  return 'random-walk-fm';
}

/** Least-squares slope of ln σ on ln τ over points [a, b]. */
function logSlope(tau: number[], dev: number[], a: number, b: number): number | null {
  const n = b - a + 1;
  if (n < 2) return null;
  let sx = 0;
  let sy = 0;
  for (let i = a; i <= b; i++) {
    sx += Math.log(tau[i]);
    sy += Math.log(dev[i]);
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = a; i <= b; i++) {
    const dx = Math.log(tau[i]) - mx;
    sxx += dx * dx;
    sxy += dx * (Math.log(dev[i]) - my);
  }
  return sxy / sxx;
}

/** Allan deviation at the averaging factors of the options (see the header). */
export function allanDeviation(input: AllanInput, options: AllanOptions): AllanResult {
  const o = resolveAllanOptions(input, options);
  const x = phaseTime(input, o);
  const N = x.length;
  const tau0 = o.sampleIntervalS;
  const warnings: string[] = [];
  const raw = o.averagingFactors.map((m) => {
    const { variance, terms } = allanVariance(x, m, tau0, o.estimator === 'overlapping' ? 1 : m);
    return { m, tauS: m * tau0, variance, terms };
  });
  const tau = raw.map((r) => r.tauS);
  const dev = raw.map((r) => Math.sqrt(r.variance));
  const positive = dev.every((d) => d > 0);
  if (!positive) warnings.push('σ_y is 0 at some τ (a constant or linear phase record): no slopes were read');
  // local slope over each point and its neighbours
  const slopes = raw.map((_, i) => (positive ? logSlope(tau, dev, Math.max(0, i - 1), Math.min(raw.length - 1, i + 1)) : null));
  const classes = slopes.map((s) => (s === null ? null : classifySlope(s)));
  const lowQ = (1 - o.confidence) / 2;
  const highQ = (1 + o.confidence) / 2;
  const points: AllanPoint[] = raw.map((r, i) => {
    const cls = classes[i];
    const edfType: AllanNoiseType = o.noiseType !== 'auto' ? o.noiseType : cls === null ? 'white-fm' : cls === 'pm' ? 'white-pm' : cls;
    const edf = o.estimator === 'overlapping' ? overlappingAllanEdf(edfType, N, r.m) : Math.max(1, r.terms);
    // σ² · edf/χ²: the upper χ² quantile gives the lower bound
    const lo = Math.sqrt((r.variance * edf) / chiSquareQuantile(highQ, edf));
    const hi = Math.sqrt((r.variance * edf) / chiSquareQuantile(lowQ, edf));
    return {
      averagingFactor: r.m,
      tauS: r.tauS,
      deviation: dev[i],
      variance: r.variance,
      terms: r.terms,
      edf,
      edfNoiseType: edfType,
      interval: [lo, hi],
      localSlope: slopes[i],
      slopeClass: cls,
    };
  });
  const regions: AllanRegion[] = [];
  let start = 0;
  for (let i = 1; i <= points.length; i++) {
    if (i === points.length || classes[i] !== classes[start]) {
      const cls = classes[start];
      if (cls !== null) {
        regions.push({
          slopeClass: cls,
          referenceSlope: REFERENCE_SLOPE[cls],
          fittedSlope: logSlope(tau, dev, start, i - 1),
          tauRangeS: [tau[start], tau[i - 1]],
        });
      }
      start = i;
    }
  }
  if (points.some((p) => p.terms < 10)) {
    warnings.push('the longest τ rest on fewer than 10 second differences: their intervals are wide');
  }
  return { estimator: o.estimator, confidence: o.confidence, phasePoints: N, points, regions, warnings };
}

// ---- σ_y from a power-law model (METHODS 5.2) ----

export interface FractionalPowerLaw {
  /** h₀^(y), 1/Hz (white FM) */
  whiteFm?: number;
  /** h₋₁^(y), dimensionless (flicker FM) */
  flickerFm?: number;
  /** h₋₂^(y), Hz (random-walk FM) */
  randomWalkFm?: number;
}

/**
 * σ_y²(τ) of the frequency-noise terms of the power-law model, IEEE Std 1139-2008 / NIST SP 1065
 * (table from memory, checked numerically in METHODS 5.2): h₀/(2τ) + 2 ln2·h₋₁ + (2π²/3)·h₋₂·τ.
 */
export function powerLawAllanVariance(model: FractionalPowerLaw, tauS: number): number {
  if (!(tauS > 0 && Number.isFinite(tauS))) throw new AnalysisInputError(`tauS must be a positive number of seconds, got ${tauS}`);
  const h0 = model.whiteFm ?? 0;
  const hm1 = model.flickerFm ?? 0;
  const hm2 = model.randomWalkFm ?? 0;
  for (const [name, v] of [['whiteFm', h0], ['flickerFm', hm1], ['randomWalkFm', hm2]] as const) {
    if (!(Number.isFinite(v) && v >= 0)) throw new AnalysisInputError(`${name} must be a finite number >= 0, got ${v}`);
  }
  return h0 / (2 * tauS) + 2 * Math.LN2 * hm1 + ((2 * Math.PI * Math.PI) / 3) * hm2 * tauS;
}

/**
 * σ_y(τ) of a laser with white frequency noise only (Lorentzian FWHM Δν = π h0):
 * σ_y = √(h0/(2τ))/ν0 = √(Δν/(2πτ))/ν0 (METHODS 5.2). Check: 1 kHz at 193.1 THz, τ = 1 s → 6.5332e-14.
 */
export function whiteFmAllanDeviation(linewidthHz: number, carrierFrequencyHz: number, tauS: number): number {
  if (!(linewidthHz >= 0 && Number.isFinite(linewidthHz))) throw new AnalysisInputError(`linewidthHz must be >= 0, got ${linewidthHz}`);
  if (!(carrierFrequencyHz > 0 && Number.isFinite(carrierFrequencyHz))) {
    throw new AnalysisInputError(`carrierFrequencyHz must be > 0, got ${carrierFrequencyHz}`);
  }
  const h0y = linewidthHz / Math.PI / (carrierFrequencyHz * carrierFrequencyHz); // h0^(y) = h0/ν0², h0 = Δν/π
  return Math.sqrt(powerLawAllanVariance({ whiteFm: h0y }, tauS));
}
