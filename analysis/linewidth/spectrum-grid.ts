/**
 * Checks and interpolation shared by the linewidth and noise-model figures: one place that validates a
 * `Spectrum` (one-sided S_ν in Hz²/Hz on an increasing grid, log or linear) and reads it between points.
 *
 * Usage:
 *   import { checkSpectrum, psdAt, firstIndexAtOrAbove, pointAverages } from '../linewidth/spectrum-grid';
 *   checkSpectrum(spectrum, 'betaLine');          // throws AnalysisInputError naming the broken rule
 *   psdAt(spectrum.frequencyHz, spectrum.psd, 123.4);
 *   pointAverages(spectrum, 'whiteFloor');        // the spectrum's `averages` (K per point) or null
 *   lowEnd(spectrum, 1 / T0);                     // where an integral from 1/T0 starts, and how
 *
 * Interpolation: between two grid points with positive f and S the spectrum is read as the power law
 * through them (straight line on log-log axes: exact for every h_a·f^a term on its own, and the usual
 * way a log-frequency spectrum is drawn); where a value is 0 or f = 0 it falls back to a straight line.
 * Estimated spectra (Welch bins, log-binned means) are bin averages: there `linear` (straight lines in
 * f, the trapezoid rule) keeps each point's share Σ S·Δf of the integral, so a spectral line covering two
 * or three bins keeps its power — the power law through a peak and its low neighbours drops too fast
 * and loses 20–50 % of it. On a smooth power law the trapezoid reads high by only (q + 1/q)/2 − 1 for
 * 1/f² at grid ratio q (0.3 % at 30 points per decade).
 * Averages: a Welch or log-frequency spectrum (WelchSpectrum, LogFrequencySpectrum) carries the number of
 * segments K behind each point; each point is then ≈ S·χ²_ν/ν with ν ≈ 2K_eff, relative variance ≈ 1/K_eff
 * (Phaseloom METHODS 1.3). `pointAverages` hands the per-point K to the fits, which weight by it.
 * Low end (our rule, stated here; used by the β-line and the lineshape, which integrate from 1/T0): a
 * log-frequency cascade's lowest point f1 lies between 1/T0 and ≈ 2/T0 for T0 = the record length
 * (analysis/spectrum/log-frequency.ts). When 1/T0 < f1 <= 2.1/T0, S_ν is taken flat at the first point's
 * level from f1 down to 1/T0 — a documented approximation: exact for a white spectrum (it adds
 * S(f1)·(f1 − 1/T0) to ∫S df), low by 1 − 1/(2 ln 2) = 28 % of that slice for a 1/f spectrum when
 * f1 = 2/T0 — and a note says so. When f1 > 2.1/T0 (say a T0 longer than the record) the integral starts at
 * f1 and the caller warns that it is a lower bound. A DC bin (f = 0) is never used for this.
 * Worked check: points (10 Hz, 100), (1000 Hz, 1) → psdAt(…, 100) = 10 (the 1/f law through them).
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

/** Throws AnalysisInputError unless the spectrum has ≥ 2 points, equal lengths, finite increasing f ≥ 0 and finite S ≥ 0. */
export function checkSpectrum(spectrum: Spectrum, who: string): void {
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  if (!(f instanceof Float64Array) || !(s instanceof Float64Array)) {
    throw new AnalysisInputError(`${who}: frequencyHz and psd must be Float64Arrays`);
  }
  if (f.length !== s.length) {
    throw new AnalysisInputError(`${who}: frequencyHz and psd must have equal lengths, got ${f.length} and ${s.length}`);
  }
  if (f.length < 2) {
    throw new AnalysisInputError(`${who}: the spectrum needs at least 2 points, got ${f.length}`);
  }
  for (let i = 0; i < f.length; i++) {
    if (!Number.isFinite(f[i]) || f[i] < 0) {
      throw new AnalysisInputError(`${who}: frequencies must be finite and >= 0, got ${f[i]}`, `point ${i}`);
    }
    if (i > 0 && !(f[i] > f[i - 1])) {
      throw new AnalysisInputError(`${who}: frequencies must increase strictly, got ${f[i - 1]} then ${f[i]}`, `point ${i}`);
    }
    if (!Number.isFinite(s[i]) || s[i] < 0) {
      throw new AnalysisInputError(`${who}: S_ν values must be finite and >= 0, got ${s[i]}`, `point ${i}`);
    }
  }
}

/**
 * The spectrum's per-point averages K_j when it carries them (`averages`: a Float64Array of one finite
 * value >= 1 per point, as a log-frequency spectrum has); null for a plain Spectrum or a scalar count.
 * Throws AnalysisInputError when an `averages` array is present but broken.
 */
export function pointAverages(spectrum: Spectrum, who: string): Float64Array | null {
  const k = (spectrum as Spectrum & { averages?: unknown }).averages;
  if (!(k instanceof Float64Array)) return null;
  if (k.length !== spectrum.frequencyHz.length) {
    throw new AnalysisInputError(`${who}: averages must have one value per point, got ${k.length} for ${spectrum.frequencyHz.length} points`);
  }
  for (let i = 0; i < k.length; i++) {
    if (!Number.isFinite(k[i]) || k[i] < 1) {
      throw new AnalysisInputError(`${who}: averages must be finite and >= 1, got ${k[i]}`, `point ${i}`);
    }
  }
  return k;
}

/** Largest f1·T0 for which the first point is stretched flat down to 1/T0 (the cascade's lowest point is within ≈ 2/T0). */
export const LOW_END_EXTENSION_FACTOR = 2.1;

export interface LowEnd {
  /** index and frequency of the first positive grid point */
  firstIndex: number;
  firstHz: number;
  /** where the integral starts: 1/T0, or the first point when the gap is too wide */
  startHz: number;
  /** the first point's level is stretched flat from firstHz down to startHz */
  extended: boolean;
  /** the note to show when extended */
  note: string | null;
}

/** Where an integral from lowHz = 1/T0 starts on this grid, by the low-end rule above. */
export function lowEnd(spectrum: Spectrum, lowHz: number): LowEnd {
  const f = spectrum.frequencyHz;
  const firstIndex = f[0] > 0 ? 0 : 1;
  const firstHz = f[firstIndex];
  if (!(lowHz < firstHz)) return { firstIndex, firstHz, startHz: lowHz, extended: false, note: null };
  if (firstHz <= LOW_END_EXTENSION_FACTOR * lowHz) {
    const level = spectrum.psd[firstIndex];
    return {
      firstIndex,
      firstHz,
      startHz: lowHz,
      extended: true,
      note:
        `S_ν below its first point (${firstHz.toPrecision(4)} Hz) was taken flat at that point's level ` +
        `(${level.toPrecision(4)} Hz²/Hz) down to 1/T0 = ${lowHz.toPrecision(4)} Hz: the spectrum's lowest point ` +
        'lies within 2/T0, and a flat extension is exact for white noise and slightly low for flicker',
    };
  }
  return { firstIndex, firstHz, startHz: firstHz, extended: false, note: null };
}

/** S_ν at x, read flat at the first positive point's level below it (never interpolated from a DC bin). */
export function psdFlatBelow(f: Float64Array, s: Float64Array, firstIndex: number, x: number, linear = false): number {
  return x <= f[firstIndex] ? s[firstIndex] : psdAt(f, s, x, linear);
}

/** Index of the first grid frequency >= x (f.length when none). Binary search. */
export function firstIndexAtOrAbove(f: Float64Array, x: number): number {
  let lo = 0;
  let hi = f.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (f[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** S_ν between grid points i and i+1 at x (f[i] <= x <= f[i+1]): power law when possible (unless `linear`), else linear. */
export function psdOnSegment(f: Float64Array, s: Float64Array, i: number, x: number, linear = false): number {
  const f0 = f[i];
  const f1 = f[i + 1];
  const s0 = s[i];
  const s1 = s[i + 1];
  if (x <= f0) return s0;
  if (x >= f1) return s1;
  if (!linear && f0 > 0 && s0 > 0 && s1 > 0) {
    // power law through both points: S = s0 · (x/f0)^p, p = ln(s1/s0)/ln(f1/f0)
    const p = Math.log(s1 / s0) / Math.log(f1 / f0);
    return s0 * Math.exp(p * Math.log(x / f0));
  }
  return s0 + ((s1 - s0) * (x - f0)) / (f1 - f0);
}

/** S_ν at x inside [f[0], f[last]] (`linear`: straight lines between the points). */
export function psdAt(f: Float64Array, s: Float64Array, x: number, linear = false): number {
  const j = firstIndexAtOrAbove(f, x);
  if (j >= f.length) return s[f.length - 1];
  if (j === 0 || f[j] === x) return s[j];
  return psdOnSegment(f, s, j - 1, x, linear);
}
