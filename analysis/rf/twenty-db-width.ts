/**
 * The −20 dB width method: the full width of an RF beat spectrum 20 dB below its peak, and the FWHM it
 * implies for a Lorentzian or a Gaussian line.
 *
 * Usage:
 *   import { twentyDbWidth } from '../analysis/rf/twenty-db-width';
 *   const r = twentyDbWidth(spectrum);           // spectrum: { frequencyHz, powerMw }
 *   r.widthHz; r.lorentzianFwhmHz; r.gaussianFwhmHz
 *
 * Method (Phaseloom METHODS 4.2): the crossings of P_peak/100 nearest the maximum on each side, each
 * by linear interpolation of the dB values between the two points around it; the width is their
 * distance. The wings of a line are far better resolved than its top, which is why the method is common
 * with delayed self-heterodyne spectra. Conversion [derived from the shapes]:
 *   Lorentzian (w/2)²/(x² + (w/2)²) = 1/100 at x = (w/2)√99   → FWHM = W₋₂₀/√99 = W₋₂₀/9.950
 *   Gaussian   exp(−4 ln2 x²/w²) = 1/100 at x = (w/2)√(ln100/ln2) → FWHM = W₋₂₀/2.578
 * Levels are absolute (no baseline is removed): the floor must lie well below −20 dB; a warning when
 * it is less than 30 dB below the peak (the floor adds to the wings), an error when the spectrum does
 * not fall 20 dB on both sides.
 * Worked check: a Lorentzian of FWHM 1 kHz on a −60 dB floor → W₋₂₀ = 9.950 kHz within the floor's effect.
 */

import { AnalysisInputError } from '../errors';
import type { RfSpectrum } from './spectrum-csv';

export const LORENTZIAN_TWENTY_DB_FACTOR = Math.sqrt(99);
export const GAUSSIAN_TWENTY_DB_FACTOR = Math.sqrt(Math.log(100) / Math.LN2);

export interface TwentyDbWidth {
  /** full width 20 dB below the peak, Hz */
  widthHz: number;
  /** the two crossings, Hz */
  crossingsHz: [number, number];
  peakHz: number;
  peakMw: number;
  /** W₋₂₀/√99 */
  lorentzianFwhmHz: number;
  /** W₋₂₀/√(ln100/ln2) */
  gaussianFwhmHz: number;
  /** lowest level in the spectrum below the peak, dB (positive) */
  floorDepthDb: number;
  warnings: string[];
}

export function twentyDbWidth(spectrum: RfSpectrum): TwentyDbWidth {
  const f = spectrum?.frequencyHz;
  const p = spectrum?.powerMw;
  if (!(f instanceof Float64Array) || !(p instanceof Float64Array) || f.length !== p.length) {
    throw new AnalysisInputError('the spectrum must hold frequencyHz and powerMw as Float64Arrays of equal length');
  }
  if (f.length < 5) throw new AnalysisInputError(`the −20 dB width needs at least 5 points, got ${f.length}`);
  let k = 0;
  let min = Infinity;
  for (let i = 0; i < p.length; i++) {
    if (!(Number.isFinite(p[i]) && p[i] >= 0 && Number.isFinite(f[i]))) throw new AnalysisInputError('powers must be finite and >= 0 (linear, mW)', `point ${i}`);
    if (i > 0 && !(f[i] > f[i - 1])) throw new AnalysisInputError('frequencies must increase strictly', `point ${i}`);
    if (p[i] > p[k]) k = i;
    if (p[i] < min) min = p[i];
  }
  const peak = p[k];
  if (!(peak > 0)) throw new AnalysisInputError('the spectrum holds no power');
  const level = peak / 100; // −20 dB
  const db = (v: number) => 10 * Math.log10(Math.max(v, peak * 1e-30));
  const crossing = (dir: 1 | -1): number => {
    for (let i = k; i + dir >= 0 && i + dir < p.length; i += dir) {
      if (p[i + dir] <= level) {
        // linear in dB between the two points around the crossing
        const a = db(p[i]);
        const b = db(p[i + dir]);
        const t = (a - (db(peak) - 20)) / (a - b);
        return f[i] + t * (f[i + dir] - f[i]);
      }
    }
    throw new AnalysisInputError(
      `the spectrum does not fall 20 dB below its peak on the ${dir < 0 ? 'low' : 'high'}-frequency side: widen the span or lower the floor`,
    );
  };
  const lo = crossing(-1);
  const hi = crossing(1);
  const widthHz = hi - lo;
  const floorDepthDb = db(peak) - db(min);
  const warnings: string[] = [];
  if (floorDepthDb < 30) warnings.push(`the floor is only ${floorDepthDb.toFixed(1)} dB below the peak: it widens the −20 dB crossings`);
  const spacing = (f[f.length - 1] - f[0]) / (f.length - 1);
  if (widthHz < 5 * spacing) warnings.push('the −20 dB width spans fewer than 5 frequency points: it is poorly resolved');
  return {
    widthHz,
    crossingsHz: [lo, hi],
    peakHz: f[k],
    peakMw: peak,
    lorentzianFwhmHz: widthHz / LORENTZIAN_TWENTY_DB_FACTOR,
    gaussianFwhmHz: widthHz / GAUSSIAN_TWENTY_DB_FACTOR,
    floorDepthDb,
    warnings,
  };
}
