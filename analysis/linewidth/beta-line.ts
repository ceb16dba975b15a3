/**
 * β-separation-line integrated linewidth (Di Domenico, Schilt, Thomann 2010).
 *
 * Usage:
 *   import { betaLine, betaSeparation } from '../analysis/linewidth/beta-line';
 *   const r = betaLine(spectrum, { observationTimeS: 1e-2 });          // any grid (log or linear)
 *   r.linewidthHz; r.areaHz2; r.crossingHz; r.truncated; r.carrierDominated; r.warnings
 *   betaSeparation(1e4);                                               // β(f) = 8 ln2 f/π², Hz²/Hz
 */

import type { BetaLineResult, Spectrum } from '../types';

export interface BetaLineOptions {
  /** observation time T0 (s): the area starts at 1/T0 */
  observationTimeS: number;
  /** top of the trusted band, Hz; default the top grid frequency */
  maxHz?: number;
}

/** β(f) = 8 ln2 · f / π², Hz²/Hz. */
export function betaSeparation(frequencyHz: number): number {
  return (8 * Math.LN2 * frequencyHz) / (Math.PI * Math.PI);
}

export function betaLine(spectrum: Spectrum, options: BetaLineOptions): BetaLineResult {
  void spectrum;
  void options;
  throw new Error('betaLine: not implemented yet');
}
