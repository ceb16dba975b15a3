/**
 * Optical lineshape and its FWHM from the whole measured S_ν (Elliott, Roy, Smith 1982).
 *
 * Usage:
 *   import { lineshape } from '../analysis/linewidth/lineshape';
 *   const r = lineshape(spectrum, { observationTimeS: 1e-2, tailLevelHz2PerHz: floor.valueHz2PerHz });
 *   r.fwhmHz (null when carrier-dominated); r.offsetHz / r.power (sampled line, power 1 at 0); r.warnings
 */

import type { LineshapeResult, Spectrum } from '../types';

export interface LineshapeOptions {
  /** observation time T0 (s): S_ν is cut off below 1/T0 */
  observationTimeS: number;
  /** top of the trusted band, Hz; default the top grid frequency */
  maxHz?: number;
  /** white level appended analytically above maxHz, Hz²/Hz; default the mean S_ν of the last 5 points */
  tailLevelHz2PerHz?: number;
  /** number of samples of the displayed line; default 129 */
  displayPoints?: number;
  /** displayed offsets run from 0 to this many FWHM; default 4 */
  displaySpanFwhm?: number;
}

export function lineshape(spectrum: Spectrum, options: LineshapeOptions): LineshapeResult {
  void spectrum;
  void options;
  throw new Error('lineshape: not implemented yet');
}
