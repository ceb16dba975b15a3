/**
 * Linewidth against output power: the fit Δν(P) = a/P + Δν₀ by linear least squares in x = 1/P, with
 * the slope a (Hz·W), the power-independent floor Δν₀ (Hz), their covariance and r².
 *
 * Usage:
 *   import { fitLinewidthPowerSweep } from '../analysis/laser/power-sweep';
 *   const r = fitLinewidthPowerSweep({ powersMw: [2, 4, 6], linewidthsHz: [1.15e6, 650e3, 483e3] });
 *   r.slopeHzW; r.floorHz; r.r2; r.covariance
 *
 * Model (Phaseloom METHODS 6.3): above threshold the intrinsic linewidth falls as 1/P (Schawlow–Townes,
 * Henry); measured linewidths usually follow Δν = a/P + Δν₀ with a floor from 1/f noise, spatial hole
 * burning or side modes (from memory). Use points well above threshold.
 * Fit: ordinary least squares in x = 1/P [1/W] (weighted by 1/σ² when uncertainties are given):
 *   [a, Δν₀] = (XᵀWX)⁻¹XᵀWy, X = [x, 1]. Covariance: (XᵀWX)⁻¹ with given σ (absolute), else
 *   s²(XᵀX)⁻¹ with s² = Σr²/(n − 2) (needs n ≥ 3). r² = 1 − Σw r²/Σw (y − ȳ_w)².
 * Units: powers in mW in (converted to W), linewidths in Hz; slope in Hz·W, floor in Hz.
 * Worked check: P = [2, 4, 6, 8, 10, 15, 20] mW, Δν = 2000/P[W] + 150 kHz → a = 2000 Hz·W, Δν₀ = 150 kHz, r² = 1.
 */

import { AnalysisInputError } from '../errors';

export interface PowerSweepInput {
  powersMw: ArrayLike<number>;
  linewidthsHz: ArrayLike<number>;
  /** standard uncertainties of the linewidths, Hz (optional) */
  uncertaintiesHz?: ArrayLike<number>;
}

export interface PowerSweepFit {
  /** a in Δν = a/P + Δν₀, Hz·W */
  slopeHzW: number;
  /** Δν₀, Hz */
  floorHz: number;
  slopeUncertaintyHzW: number;
  floorUncertaintyHz: number;
  /** [[var a, cov], [cov, var Δν₀]] */
  covariance: [[number, number], [number, number]];
  r2: number;
  points: number;
  /** measured − fitted, Hz */
  residualsHz: Float64Array;
  weighted: boolean;
  warnings: string[];
}

export function fitLinewidthPowerSweep(input: PowerSweepInput): PowerSweepFit {
  if (!input || typeof input !== 'object') throw new AnalysisInputError('the sweep must be an object with powersMw and linewidthsHz');
  const p = input.powersMw;
  const y = input.linewidthsHz;
  const s = input.uncertaintiesHz;
  if (!p || !y || p.length !== y.length) {
    throw new AnalysisInputError(`powersMw and linewidthsHz must have equal lengths, got ${p?.length} and ${y?.length}`);
  }
  const n = p.length;
  if (n < 3) throw new AnalysisInputError(`the sweep needs at least 3 points (two parameters and their uncertainties), got ${n}`);
  if (s !== undefined && s.length !== n) throw new AnalysisInputError(`uncertaintiesHz must have ${n} values, got ${s.length}`);
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    if (!(Number.isFinite(p[i]) && p[i] > 0)) throw new AnalysisInputError(`powers must be positive, got ${p[i]}`, `point ${i}`);
    if (!(Number.isFinite(y[i]) && y[i] >= 0)) throw new AnalysisInputError(`linewidths must be finite and >= 0, got ${y[i]}`, `point ${i}`);
    if (s !== undefined && !(Number.isFinite(s[i]) && s[i] > 0)) throw new AnalysisInputError(`uncertainties must be positive, got ${s[i]}`, `point ${i}`);
    x[i] = 1 / (p[i] * 1e-3); // x = 1/P [1/W]
    w[i] = s === undefined ? 1 : 1 / (s[i] * s[i]);
  }
  // weighted normal equations about the weighted means (centred: well conditioned)
  let sw = 0;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sw += w[i];
    sx += w[i] * x[i];
    sy += w[i] * y[i];
  }
  const mx = sx / sw;
  const my = sy / sw;
  let sxx = 0;
  let sxy = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = x[i] - mx;
    const dy = y[i] - my;
    sxx += w[i] * dx * dx;
    sxy += w[i] * dx * dy;
    syy += w[i] * dy * dy;
  }
  if (!(sxx > 0)) throw new AnalysisInputError('the sweep needs at least two different powers');
  const a = sxy / sxx;
  const b = my - a * mx;
  const residualsHz = new Float64Array(n);
  let ssr = 0;
  for (let i = 0; i < n; i++) {
    residualsHz[i] = y[i] - (a * x[i] + b);
    ssr += w[i] * residualsHz[i] * residualsHz[i];
  }
  // (XᵀWX)⁻¹ in the centred form: var a = 1/Sxx, var b = 1/Sw + mx²/Sxx, cov = −mx/Sxx
  const scale = s === undefined ? ssr / (n - 2) : 1;
  const va = scale / sxx;
  const vb = scale * (1 / sw + (mx * mx) / sxx);
  const cab = (-scale * mx) / sxx;
  const warnings: string[] = [];
  if (a < 0) warnings.push('the slope is negative: the linewidth grows with power (re-broadening or a mode hop?), not the 1/P law');
  if (b < 0) warnings.push('the floor is negative: the points may not be well above threshold, or the 1/P law does not hold');
  return {
    slopeHzW: a,
    floorHz: b,
    slopeUncertaintyHzW: Math.sqrt(va),
    floorUncertaintyHz: Math.sqrt(vb),
    covariance: [
      [va, cab],
      [cab, vb],
    ],
    r2: syy > 0 ? 1 - ssr / syy : 1,
    points: n,
    residualsHz,
    weighted: s !== undefined,
    warnings,
  };
}
