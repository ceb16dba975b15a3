/**
 * Phase-error integrals of a laser pair's frequency noise through a weighting |1 − H(f)|²:
 * σ² = ∫₀^∞ S_ν,tot(f)/f² · W(f) df, for weights periodic in the symbol rate (discrete-time estimators,
 * the per-symbol phase increment) or not (a continuous tracking loop); and the Wiener phase-increment
 * variance per symbol.
 *
 * Usage:
 *   import { frequencyNoise, integratePhaseError, wienerIncrementVariance } from '../analysis/budget/phase-noise-integral';
 *   const noise = frequencyNoise({ whiteHz2PerHz: 1e5 / Math.PI });                 // a 100 kHz Lorentzian pair
 *   wienerIncrementVariance(noise, 32e9);                                            // 2πΔνT_s = 1.963e-5 rad²
 *   const noise2 = frequencyNoise({ spectra: [{ spectrum }], whiteHz2PerHz: 0 });    // a measured S_ν
 *
 * S_ν,tot (one-sided, Hz²/Hz; Phaseloom METHODS 7.3): the sum of the white level and of each spectrum, read
 * by power-law interpolation between its points (analysis/linewidth/spectrum-grid.ts), held at its first
 * value below its grid and at its tail level (default its last value) above it. Phase S_φ = S_ν/f².
 * Periodic weights (period R_s = 1/T_s), by folding the one-sided spectrum onto one period:
 *   σ² = ∫₀^{R_s} W(u) Σ_{k≥0} S_φ(u + kR_s) du,
 *   the sum explicit while u + kR_s can meet a grid (up to k = 64; beyond, W is replaced by its mean over the
 *   period, S_φ changing by < 3 % across one), then T·ψ₁(K + 1 + u/R_s)/R_s² for a constant tail T
 *   (trigamma ψ₁ by recurrence and its asymptotic series, M. Abramowitz, I. A. Stegun, "Handbook of
 *   Mathematical Functions" (1964), 6.4.12 — from memory). For discrete-time estimators "H periodic in R_s
 *   accounts for aliasing automatically" (METHODS 7.3).
 * Aperiodic weights: the integral on [0, F] plus the tail T·∫_F^∞ W(f)/f² df in closed form (given by the weight).
 * Quadrature: 5-point Gauss–Legendre on pieces bounded by a log grid (100/decade), every spectrum grid
 *   point and the weight's own break points (no piece wider than given by the weight); below the lowest
 *   piece the integrand is taken as S(f_lo)·W(f)/f² with W ∝ f⁴ or f², integrated in closed form by the weight.
 * Wiener increment (METHODS 7.1): σ_p²(T_s) = 4∫ S_ν sin²(πfT_s)/f² df (W = 4 sin²(πfT_s)); 2π²h₀T_s = 2πΔνT_s
 *   for white noise. Worked check: Δν = 100 kHz, R_s = 32 GBd → 1.963e-5 rad².
 */

import { AnalysisInputError } from '../errors';
import { checkSpectrum, firstIndexAtOrAbove, psdOnSegment } from '../linewidth/spectrum-grid';
import type { Spectrum } from '../types';

export interface FrequencyNoiseSpectrum {
  spectrum: Spectrum;
  /** S_ν above the grid, Hz²/Hz (default the last value) */
  tailLevelHz2PerHz?: number;
}

export interface FrequencyNoiseInput {
  spectra?: FrequencyNoiseSpectrum[];
  /** white level added everywhere, Hz²/Hz (a Lorentzian laser of FWHM Δν adds Δν/π) */
  whiteHz2PerHz?: number;
}

/** A resolved frequency-noise description: S_ν,tot(f) = white + Σ spectra. */
export interface FrequencyNoise {
  white: number;
  parts: { f: Float64Array; s: Float64Array; tail: number }[];
  /** lowest grid frequency > 0 (Infinity without spectra) */
  lowestHz: number;
  /** highest grid frequency (0 without spectra) */
  highestHz: number;
  /** S_ν above every grid: white + Σ tails */
  tailLevel: number;
}

export function frequencyNoise(input: FrequencyNoiseInput): FrequencyNoise {
  const white = input?.whiteHz2PerHz ?? 0;
  if (!(Number.isFinite(white) && white >= 0)) throw new AnalysisInputError(`whiteHz2PerHz must be a finite number >= 0, got ${white}`);
  const parts: FrequencyNoise['parts'] = [];
  let lowest = Infinity;
  let highest = 0;
  (input?.spectra ?? []).forEach((entry, i) => {
    const sp = entry?.spectrum;
    checkSpectrum(sp, `spectra[${i}]`);
    // drop f = 0 (S_φ = S_ν/f² is not defined there)
    const start = sp.frequencyHz[0] > 0 ? 0 : 1;
    const f = sp.frequencyHz.subarray(start);
    const s = sp.psd.subarray(start);
    if (f.length < 2) throw new AnalysisInputError(`spectra[${i}]: needs at least 2 points above 0 Hz`);
    const tail = entry.tailLevelHz2PerHz ?? s[s.length - 1];
    if (!(Number.isFinite(tail) && tail >= 0)) throw new AnalysisInputError(`spectra[${i}].tailLevelHz2PerHz must be >= 0, got ${tail}`);
    parts.push({ f, s, tail });
    lowest = Math.min(lowest, f[0]);
    highest = Math.max(highest, f[f.length - 1]);
  });
  if (parts.length === 0 && white === 0) throw new AnalysisInputError('the frequency noise is zero: give a spectrum or a white level');
  return { white, parts, lowestHz: lowest, highestHz: highest, tailLevel: white + parts.reduce((t, p) => t + p.tail, 0) };
}

/** S_ν,tot(f), Hz²/Hz. */
export function frequencyNoiseAt(noise: FrequencyNoise, f: number): number {
  let total = noise.white;
  for (const p of noise.parts) {
    const n = p.f.length;
    if (f <= p.f[0]) total += p.s[0];
    else if (f >= p.f[n - 1]) total += f === p.f[n - 1] ? p.s[n - 1] : p.tail;
    else total += psdOnSegment(p.f, p.s, firstIndexAtOrAbove(p.f, f) - 1, f);
  }
  return total;
}

/** A weighting |1 − H(f)|² and what the integrator needs to know about it. */
export interface PhaseErrorWeight {
  /** W(f) */
  at(f: number): number;
  /** period R_s for discrete-time weights, null for continuous ones */
  periodHz: number | null;
  /** break points inside (0, period) (periodic) or (0, ∞) (aperiodic) where W is not smooth or changes scale */
  breakpointsHz: number[];
  /** no quadrature piece wider than this, Hz */
  maxPieceHz: number;
  /** low-f law W(f) ≈ c·f^q (q = 2 or 4) used below the first piece */
  lowCoefficient: number;
  lowPower: 2 | 4;
  /** periodic only: the mean of W over a period (used for periods far above R_s, where S_φ barely changes across one) */
  meanOverPeriod?: number;
  /** aperiodic only: ∫_F^∞ W(f)/f² df (multiplied by the tail level by the integrator) */
  tailIntegral?: (fromHz: number) => number;
}

// 5-point Gauss–Legendre on [−1, 1]
const GL_X = [-0.906179845938664, -0.5384693101056831, 0, 0.5384693101056831, 0.906179845938664];
const GL_W = [0.23692688505618908, 0.47862867049936647, 0.5688888888888889, 0.47862867049936647, 0.23692688505618908];

/** Trigamma ψ₁(x), x > 0: recurrence ψ₁(x) = ψ₁(x+1) + 1/x² up to x ≥ 10, then the asymptotic series (error < 1e-13). */
export function trigamma(x: number): number {
  let acc = 0;
  while (x < 10) {
    acc += 1 / (x * x);
    x += 1;
  }
  const r = 1 / x;
  const r2 = r * r;
  // 1/x + 1/(2x²) + 1/(6x³) − 1/(30x⁵) + 1/(42x⁷) − 1/(30x⁹) + 5/(66x¹¹)
  return acc + r + r2 / 2 + r * r2 * (1 / 6 + r2 * (-1 / 30 + r2 * (1 / 42 + r2 * (-1 / 30 + (5 / 66) * r2))));
}

function piecesBetween(lo: number, hi: number, noise: FrequencyNoise, weight: PhaseErrorWeight, offsets: number[]): number[] {
  const points = new Set<number>([lo, hi]);
  // log grid, 100 per decade
  const perDecade = 100;
  const a = Math.log10(lo);
  const b = Math.log10(hi);
  for (let k = Math.ceil(a * perDecade); k <= Math.floor(b * perDecade); k++) points.add(10 ** (k / perDecade));
  for (const bp of weight.breakpointsHz) if (bp > lo && bp < hi) points.add(bp);
  // spectrum grid points (shifted into the period for folded weights)
  for (const p of noise.parts) {
    for (const off of offsets) {
      for (let i = 0; i < p.f.length; i++) {
        const x = p.f[i] - off;
        if (x > lo && x < hi) points.add(x);
      }
    }
  }
  const sorted = Array.from(points).sort((x, y) => x - y);
  const out: number[] = [sorted[0]];
  for (let i = 1; i < sorted.length; i++) {
    const x0 = out[out.length - 1];
    const x1 = sorted[i];
    const n = Math.ceil((x1 - x0) / weight.maxPieceHz - 1e-12);
    for (let k = 1; k < n; k++) out.push(x0 + ((x1 - x0) * k) / n);
    out.push(x1);
  }
  return out;
}

const MAX_EXPLICIT_PERIODS = 64;

/** ∫_a^b S_ν,tot(f)/f² df on a log grid of 100 pieces per decade plus the spectrum grid points (5-point Gauss–Legendre each). */
function phaseIntegral(noise: FrequencyNoise, a: number, b: number): number {
  const points = new Set<number>([a, b]);
  for (let k = Math.ceil(Math.log10(a) * 100); k <= Math.floor(Math.log10(b) * 100); k++) points.add(10 ** (k / 100));
  for (const p of noise.parts) for (let i = 0; i < p.f.length; i++) if (p.f[i] > a && p.f[i] < b) points.add(p.f[i]);
  const edges = Array.from(points).sort((x, y) => x - y);
  let sum = 0;
  for (let i = 0; i + 1 < edges.length; i++) {
    const half = (edges[i + 1] - edges[i]) / 2;
    const mid = (edges[i + 1] + edges[i]) / 2;
    for (let g = 0; g < 5; g++) {
      const f = mid + half * GL_X[g];
      sum += (half * GL_W[g] * frequencyNoiseAt(noise, f)) / (f * f);
    }
  }
  return sum;
}

/** σ² = ∫₀^∞ S_ν,tot(f)/f² · W(f) df, rad². */
export function integratePhaseError(noise: FrequencyNoise, weight: PhaseErrorWeight): number {
  const period = weight.periodHz;
  // first piece starts well below anything that matters: the lowest grid point / 1000, or period·1e-9
  const ref = Math.min(noise.lowestHz, period ?? Infinity, ...weight.breakpointsHz.filter((x) => x > 0));
  const start = (Number.isFinite(ref) ? ref : 1) * 1e-3;
  // closed form below `start`: ∫₀^start S(f_lo)·c f^q / f² df = S·c·start^{q−1}/(q−1)
  const s0 = frequencyNoiseAt(noise, start);
  let sigma2 = (s0 * weight.lowCoefficient * start ** (weight.lowPower - 1)) / (weight.lowPower - 1);

  if (period !== null) {
    // periods that can meet a grid: explicit up to the 64th, then W replaced by its mean over the period
    // (S_φ changes by < 3 % across a period there); beyond every grid: tail · ψ₁
    const kGrid = Math.max(0, Math.ceil(noise.highestHz / period));
    const kExplicit = Math.min(kGrid, MAX_EXPLICIT_PERIODS);
    if (kGrid > kExplicit) {
      if (weight.meanOverPeriod === undefined) throw new AnalysisInputError('a periodic weight needs its mean over a period');
      const from = (kExplicit + 1) * period;
      const to = (kGrid + 1) * period;
      sigma2 += weight.meanOverPeriod * phaseIntegral(noise, from, to);
    }
    const offsets: number[] = [];
    for (let k = 0; k <= kExplicit; k++) offsets.push(k * period);
    const edges = piecesBetween(start, period, noise, weight, offsets);
    const tail = noise.tailLevel;
    for (let i = 0; i + 1 < edges.length; i++) {
      const a = edges[i];
      const b = edges[i + 1];
      const half = (b - a) / 2;
      const mid = (a + b) / 2;
      for (let g = 0; g < 5; g++) {
        const u = mid + half * GL_X[g];
        let folded = 0;
        for (let k = 0; k <= kExplicit; k++) {
          const f = u + k * period;
          folded += frequencyNoiseAt(noise, f) / (f * f);
        }
        // Σ_{k > K} T/(u + kR)² = T ψ₁(K + 1 + u/R)/R²
        folded += (tail * trigamma(kGrid + 1 + u / period)) / (period * period);
        sigma2 += half * GL_W[g] * weight.at(u) * folded;
      }
    }
    return sigma2;
  }
  const top = Math.max(noise.highestHz, ...weight.breakpointsHz) * 10;
  const edges = piecesBetween(start, top, noise, weight, [0]);
  for (let i = 0; i + 1 < edges.length; i++) {
    const a = edges[i];
    const b = edges[i + 1];
    const half = (b - a) / 2;
    const mid = (a + b) / 2;
    for (let g = 0; g < 5; g++) {
      const f = mid + half * GL_X[g];
      sigma2 += (half * GL_W[g] * weight.at(f) * frequencyNoiseAt(noise, f)) / (f * f);
    }
  }
  if (!weight.tailIntegral) throw new AnalysisInputError('an aperiodic weight needs its tail integral');
  return sigma2 + noise.tailLevel * weight.tailIntegral(top);
}

/** W(f) = 4 sin²(πfT_s): the phase increment over one symbol. */
export function symbolIncrementWeight(symbolRateBaud: number): PhaseErrorWeight {
  const ts = 1 / symbolRateBaud;
  return {
    at: (f) => 4 * Math.sin(Math.PI * f * ts) ** 2,
    periodHz: symbolRateBaud,
    breakpointsHz: [symbolRateBaud / 2],
    maxPieceHz: symbolRateBaud / 16,
    meanOverPeriod: 2, // ⟨4 sin²⟩ = 2
    lowCoefficient: 4 * (Math.PI * ts) ** 2, // 4 sin² ≈ 4π²f²T_s²
    lowPower: 2,
  };
}

/** σ_p²(T_s) = 4∫ S_ν sin²(πfT_s)/f² df, rad² (METHODS 7.1). */
export function wienerIncrementVariance(noise: FrequencyNoise, symbolRateBaud: number): number {
  if (!(symbolRateBaud > 0 && Number.isFinite(symbolRateBaud))) {
    throw new AnalysisInputError(`symbolRateBaud must be a positive number, got ${symbolRateBaud}`);
  }
  return integratePhaseError(noise, symbolIncrementWeight(symbolRateBaud));
}
