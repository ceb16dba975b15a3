/**
 * White frequency-noise floor S_ν,white and the intrinsic (Lorentzian) linewidth π·S_ν,white.
 *
 * Usage:
 *   import { whiteFloor } from '../analysis/linewidth/white-floor';
 *   const auto = whiteFloor(logSpectrum);                              // flattest low band, found automatically
 *   const given = whiteFloor(logSpectrum, { bandHz: [1e4, 1e5] });     // mean of linear S_ν over a band
 *   auto.valueHz2PerHz; auto.intrinsicLinewidthHz; auto.bandHz; auto.warnings
 */

import type { Spectrum, Spur, WhiteFloorResult } from '../types';

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

export function whiteFloor(spectrum: Spectrum, options: WhiteFloorOptions = {}): WhiteFloorResult {
  void spectrum;
  void options;
  throw new Error('whiteFloor: not implemented yet');
}
