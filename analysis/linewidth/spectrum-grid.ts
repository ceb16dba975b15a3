/**
 * Checks and interpolation shared by the linewidth and noise-model figures: one place that validates a
 * `Spectrum` (one-sided S_ν in Hz²/Hz on an increasing grid, log or linear) and reads it between points.
 *
 * Usage:
 *   import { checkSpectrum, psdAt, firstIndexAtOrAbove, pointAverages } from '../linewidth/spectrum-grid';
 *   checkSpectrum(spectrum, 'betaLine');          // throws AnalysisInputError naming the broken rule
 *   psdAt(spectrum.frequencyHz, spectrum.psd, 123.4);
 *   pointAverages(spectrum, 'whiteFloor');        // the spectrum's `averages` (K per point) or null
 *
 * Interpolation: between two grid points with positive f and S the spectrum is read as the power law
 * through them (straight line on log-log axes: exact for every h_a·f^a term on its own, and the usual
 * way a log-frequency spectrum is drawn); where a value is 0 or f = 0 it falls back to a straight line.
 * Averages: a Welch or log-frequency spectrum (WelchSpectrum, LogFrequencySpectrum) carries the number of
 * segments K behind each point; each point is then ≈ S·χ²_ν/ν with ν ≈ 2K_eff, relative variance ≈ 1/K_eff
 * (Phaseloom METHODS 1.3). `pointAverages` hands the per-point K to the fits, which weight by it.
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

/** S_ν between grid points i and i+1 at x (f[i] <= x <= f[i+1]): power law when possible, else linear. */
export function psdOnSegment(f: Float64Array, s: Float64Array, i: number, x: number): number {
  const f0 = f[i];
  const f1 = f[i + 1];
  const s0 = s[i];
  const s1 = s[i + 1];
  if (x <= f0) return s0;
  if (x >= f1) return s1;
  if (f0 > 0 && s0 > 0 && s1 > 0) {
    // power law through both points: S = s0 · (x/f0)^p, p = ln(s1/s0)/ln(f1/f0)
    const p = Math.log(s1 / s0) / Math.log(f1 / f0);
    return s0 * Math.exp(p * Math.log(x / f0));
  }
  return s0 + ((s1 - s0) * (x - f0)) / (f1 - f0);
}

/** S_ν at x inside [f[0], f[last]]. */
export function psdAt(f: Float64Array, s: Float64Array, x: number): number {
  const j = firstIndexAtOrAbove(f, x);
  if (j >= f.length) return s[f.length - 1];
  if (j === 0 || f[j] === x) return s[j];
  return psdOnSegment(f, s, j - 1, x);
}
