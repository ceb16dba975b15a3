/**
 * β-separation-line integrated linewidth (Di Domenico, Schilt, Thomann 2010).
 *
 * Usage:
 *   import { betaLine, betaSeparation } from '../analysis/linewidth/beta-line';
 *   const r = betaLine(spectrum, { observationTimeS: 1e-2 });          // any grid (log or linear)
 *   r.linewidthHz; r.areaHz2; r.crossingHz; r.truncated; r.carrierDominated; r.intervalsHz; r.warnings
 *   betaSeparation(1e4);                                               // β(f) = 8 ln2 f/π², Hz²/Hz
 *
 * Method: G. Di Domenico, S. Schilt, P. Thomann, "Simple approach to the relation between laser
 * frequency noise and laser line shape", Appl. Opt. 49(25), 4801–4807 (2010). One-sided S_ν [Hz²/Hz]:
 *   β(f) = 8 ln2 · f / π²                                   [Hz²/Hz]
 *   A    = ∫_{1/T0}^{fmax} H(S_ν(f) − β(f)) · S_ν(f) df      [Hz²]  (H = unit step)
 *   FWHM ≈ √(8 ln2 · A)                                      [Hz]
 * Rules (Phaseloom METHODS 3.3): the area is the union of every interval where S_ν > β (spurs and
 * servo bumps make several); it starts exactly at 1/T0 with a partial first bin; the crossings are
 * exact for the interpolated spectrum. Between grid points S_ν is the power law through them
 * (a straight line on log-log axes; a straight line in f where a value is 0), so on every piece
 * S_ν/β is monotonic: at most one crossing, found in closed form, and the piece's area is exact.
 * `interpolation: 'linear'` reads straight lines in f instead (estimated spectra: each bin keeps its
 * ∫S df, so a spectral line keeps its power; spectrum-grid.ts); S_ν − β is then linear on each piece:
 * again at most one crossing and an exact area.
 * Low end (spectrum-grid.ts): when the first point f1 lies within 2.1/T0 (a log-frequency cascade's
 * lowest point lies between 1/T0 and ≈ 2/T0 for T0 = the record length) S_ν is taken flat at that
 * point's level from f1 down to 1/T0 — exact for white noise (it adds S(f1)·(f1 − 1/T0) to A),
 * slightly low for flicker — and `notes` says so; further above 1/T0 the area starts at f1 with a warning.
 * Warnings: S_ν still above β at the top of the band → area truncated (a lower bound);
 * no area above 1/T0 (1/T0 >= f_x) → "line dominated by a coherent carrier at this T0";
 * the spectrum starting above 2.1/T0 → the area below it is missing (a lower bound).
 * Defaults: maxHz = the top grid frequency; interpolation 'power-law'.
 * Worked check: white S_ν = h0: f_x = π²h0/(8 ln2), A = h0(f_x − 1/T0) → FWHM = π·h0 as T0 → ∞.
 */

import { AnalysisInputError } from '../errors';
import type { BetaLineResult, Spectrum } from '../types';
import { checkSpectrum, firstIndexAtOrAbove, lowEnd, psdFlatBelow } from './spectrum-grid';

/** The β-line figures with the documented approximations that applied (`notes`, not problems). */
export interface BetaLineReport extends BetaLineResult {
  notes: string[];
}

export interface BetaLineOptions {
  /** observation time T0 (s): the area starts at 1/T0 */
  observationTimeS: number;
  /** top of the trusted band, Hz; default the top grid frequency */
  maxHz?: number;
  /** reading between points: 'power-law' (default; exact for analytic power laws) or 'linear' (for
   *  estimated spectra: keeps each bin's ∫S df, so spectral lines keep their power — spectrum-grid.ts) */
  interpolation?: 'power-law' | 'linear';
}

/** slope of the β line, c = 8 ln2 / π² (Hz²/Hz per Hz) */
const BETA_SLOPE = (8 * Math.LN2) / (Math.PI * Math.PI);

/** β(f) = 8 ln2 · f / π², Hz²/Hz. */
export function betaSeparation(frequencyHz: number): number {
  return BETA_SLOPE * frequencyHz;
}

interface ResolvedBetaLineOptions {
  observationTimeS: number;
  lowHz: number;
  startHz: number;
  maxHz: number;
  firstIndex: number;
  linear: boolean;
  warnings: string[];
  notes: string[];
}

function resolveBetaLineOptions(spectrum: Spectrum, options: BetaLineOptions): ResolvedBetaLineOptions {
  checkSpectrum(spectrum, 'betaLine');
  const f = spectrum.frequencyHz;
  const t0 = options?.observationTimeS;
  if (typeof t0 !== 'number' || !Number.isFinite(t0) || t0 <= 0) {
    throw new AnalysisInputError(`betaLine: observationTimeS must be a positive finite number, got ${t0}`);
  }
  const top = f[f.length - 1];
  const maxHz = options.maxHz ?? top;
  if (!Number.isFinite(maxHz) || maxHz <= 0 || maxHz > top) {
    throw new AnalysisInputError(`betaLine: maxHz must be in (0, ${top}] (the top of the grid), got ${maxHz}`);
  }
  const interpolation = options.interpolation ?? 'power-law';
  if (interpolation !== 'power-law' && interpolation !== 'linear') {
    throw new AnalysisInputError(`betaLine: interpolation must be 'power-law' or 'linear', got ${String(interpolation)}`);
  }
  const lowHz = 1 / t0;
  if (lowHz >= maxHz) {
    throw new AnalysisInputError(`betaLine: 1/T0 = ${lowHz} Hz must lie below the top of the band, ${maxHz} Hz`);
  }
  const warnings: string[] = [];
  const notes: string[] = [];
  const low = lowEnd(spectrum, lowHz);
  if (low.note) notes.push(low.note);
  else if (low.startHz > lowHz) {
    warnings.push(
      `the spectrum starts at ${low.firstHz} Hz, above 1/T0 = ${lowHz} Hz: the area below ${low.firstHz} Hz is missing (a lower bound)`,
    );
  }
  return {
    observationTimeS: t0,
    lowHz,
    startHz: low.startHz,
    maxHz,
    firstIndex: low.firstIndex,
    linear: interpolation === 'linear',
    warnings,
    notes,
  };
}

/** ∫_a^b of the piece through (u, su), (v, sv) — a power law or a straight line, as its grid segment. */
function pieceIntegral(powerLaw: boolean, u: number, su: number, v: number, sv: number, a: number, b: number): number {
  if (b <= a) return 0;
  if (powerLaw) {
    const p = Math.log(sv / su) / Math.log(v / u);
    // ∫_a^b su (f/u)^p df = su·u/(p+1)·[(b/u)^(p+1) − (a/u)^(p+1)];  p = −1 → su·u·ln(b/a)
    if (Math.abs(p + 1) < 1e-12) return su * u * Math.log(b / a);
    const q = p + 1;
    const ea = Math.exp(q * Math.log(a / u));
    const eb = Math.exp(q * Math.log(b / u));
    return ((su * u) / q) * (eb - ea);
  }
  const m = (sv - su) / (v - u);
  const sa = su + m * (a - u);
  const sb = su + m * (b - u);
  return 0.5 * (sa + sb) * (b - a);
}

/** Where S_ν = β on the piece (du = su − βu and dv = sv − βv have opposite signs). */
function pieceCrossing(powerLaw: boolean, u: number, su: number, v: number, sv: number, du: number, dv: number): number {
  if (powerLaw) {
    const p = Math.log(sv / su) / Math.log(v / u);
    // S/β = (su/(c u))·(f/u)^(p−1) = 1  →  f = u·(c u/su)^(1/(p−1))
    const x = u * Math.exp(Math.log((BETA_SLOPE * u) / su) / (p - 1));
    return Math.min(v, Math.max(u, x));
  }
  return u + (du / (du - dv)) * (v - u);
}

export function betaLine(spectrum: Spectrum, options: BetaLineOptions): BetaLineReport {
  const o = resolveBetaLineOptions(spectrum, options);
  const f = spectrum.frequencyHz;
  const s = spectrum.psd;
  const warnings = o.warnings;

  // nodes: every grid point from the first positive one up to maxHz, plus 1/T0 (partial first bin) and maxHz
  const firstPositiveIndex = o.firstIndex;
  const nodeHz: number[] = [];
  const nodePsd: number[] = [];
  const scanFrom = Math.min(f[firstPositiveIndex], o.startHz);
  const pushNode = (x: number) => {
    nodeHz.push(x);
    nodePsd.push(psdFlatBelow(f, s, firstPositiveIndex, x, o.linear)); // flat below the first point (low-end rule)
  };
  pushNode(scanFrom);
  let startInserted = scanFrom === o.startHz;
  for (let i = firstIndexAtOrAbove(f, scanFrom); i < f.length && f[i] < o.maxHz; i++) {
    if (!startInserted && f[i] >= o.startHz) {
      if (f[i] > o.startHz) pushNode(o.startHz);
      startInserted = true;
    }
    if (f[i] > nodeHz[nodeHz.length - 1]) pushNode(f[i]);
  }
  if (!startInserted) pushNode(o.startHz);
  if (o.maxHz > nodeHz[nodeHz.length - 1]) pushNode(o.maxHz);

  let area = 0;
  let highestDownCrossing: number | null = null;
  const intervals: [number, number][] = [];
  let openAt: number | null = null;
  for (let k = 0; k + 1 < nodeHz.length; k++) {
    const u = nodeHz[k];
    const v = nodeHz[k + 1];
    const su = nodePsd[k];
    const sv = nodePsd[k + 1];
    const du = su - BETA_SLOPE * u; // S_ν − β at each end
    const dv = sv - BETA_SLOPE * v;
    const counts = u >= o.startHz; // the area starts exactly at 1/T0 (a node)
    // the piece keeps the interpolation of the grid segment it lies in (power law unless a value is 0)
    const g = firstIndexAtOrAbove(f, v) - 1;
    const powerLaw = !o.linear && f[g] > 0 && s[g] > 0 && s[g + 1] > 0;
    if (du > 0 && dv > 0) {
      if (counts) {
        area += pieceIntegral(powerLaw, u, su, v, sv, u, v);
        if (openAt === null) openAt = u;
      }
    } else if (du > 0 || dv > 0) {
      const x = pieceCrossing(powerLaw, u, su, v, sv, du, dv);
      if (du > 0) {
        // leaving the region above β
        highestDownCrossing = x;
        if (counts) {
          area += pieceIntegral(powerLaw, u, su, v, sv, u, x);
          intervals.push([openAt ?? u, x]);
          openAt = null;
        }
      } else if (counts) {
        // entering it
        area += pieceIntegral(powerLaw, u, su, v, sv, x, v);
        openAt = x;
      }
    }
  }
  const lastExcess = nodePsd[nodePsd.length - 1] - BETA_SLOPE * o.maxHz;
  const truncated = lastExcess > 0;
  if (openAt !== null) intervals.push([openAt, o.maxHz]);
  if (truncated) {
    warnings.push(
      `S_ν is still above the β line at the top of the band (${o.maxHz} Hz): the area is truncated and the linewidth is a lower bound`,
    );
  }
  const carrierDominated = !(area > 0);
  if (carrierDominated) {
    const where = highestDownCrossing === null ? 'S_ν never rises above the β line' : `f_x = ${highestDownCrossing.toPrecision(4)} Hz`;
    warnings.push(`line dominated by a coherent carrier at this T0: 1/T0 = ${o.lowHz.toPrecision(4)} Hz, ${where}`);
  }
  return {
    observationTimeS: o.observationTimeS,
    crossingHz: truncated ? null : highestDownCrossing,
    areaHz2: area,
    // FWHM ≈ √(8 ln2 · A)
    linewidthHz: Math.sqrt(8 * Math.LN2 * area),
    truncated,
    carrierDominated,
    intervalsHz: intervals,
    warnings,
    notes: o.notes,
  };
}
