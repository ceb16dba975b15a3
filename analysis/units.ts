/**
 * Optical units: wavelength ↔ optical frequency, and a frequency width ↔ a wavelength width.
 *
 * Usage:
 *   import { frequencyThzToWavelengthNm, frequencyWidthHzToWavelengthWidthPm } from '../analysis/units';
 *   frequencyThzToWavelengthNm(193.1);                       // 1552.5244 nm
 *   frequencyWidthHzToWavelengthWidthPm(0.1e9, 193.1);       // 0.80400 pm
 *
 * Formulas: λ = c/ν; Δλ = λ²·Δν/c = c·Δν/ν² (first order in Δν/ν, the usual way to quote a linewidth).
 * Constants: c = 299 792 458 m/s and h = 6.626 070 15 × 10⁻³⁴ J·s are exact by definition —
 * BIPM, "The International System of Units (SI)", 9th edition (2019).
 * Units in and out: nm, THz, Hz, pm as named in each function.
 * Worked check: 0.1 GHz at 193.1 THz → Δλ = 0.80400 pm (c·Δν/ν² = 2.99792458e8·1e8/(1.931e14)² m).
 */

import { AnalysisInputError } from './errors';

/** Speed of light in vacuum, m/s (exact, SI 2019). */
export const SPEED_OF_LIGHT_M_PER_S = 299_792_458;

/** Planck constant, J·s (exact, SI 2019). */
export const PLANCK_CONSTANT_J_S = 6.626_070_15e-34;

function requirePositive(value: number, name: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new AnalysisInputError(`${name} must be a positive finite number, got ${value}`);
  }
}

/** λ [nm] → ν [THz]: ν = c/λ. */
export function wavelengthNmToFrequencyThz(wavelengthNm: number): number {
  requirePositive(wavelengthNm, 'wavelengthNm');
  // c [m/s] / (λ [nm]·1e-9) [Hz] / 1e12 [THz] = c / λ[nm] / 1e3
  return SPEED_OF_LIGHT_M_PER_S / wavelengthNm / 1e3;
}

/** ν [THz] → λ [nm]: λ = c/ν. */
export function frequencyThzToWavelengthNm(frequencyThz: number): number {
  requirePositive(frequencyThz, 'frequencyThz');
  return SPEED_OF_LIGHT_M_PER_S / frequencyThz / 1e3;
}

/** Δν [Hz] at the optical frequency ν [THz] → Δλ [pm]: Δλ = λ²·Δν/c. */
export function frequencyWidthHzToWavelengthWidthPm(widthHz: number, frequencyThz: number): number {
  requirePositive(frequencyThz, 'frequencyThz');
  if (!Number.isFinite(widthHz) || widthHz < 0) {
    throw new AnalysisInputError(`widthHz must be a finite number >= 0, got ${widthHz}`);
  }
  const lambdaM = SPEED_OF_LIGHT_M_PER_S / (frequencyThz * 1e12);
  // Δλ = λ²·Δν/c  [m] → pm
  return ((lambdaM * lambdaM * widthHz) / SPEED_OF_LIGHT_M_PER_S) * 1e12;
}

/** Δλ [pm] at the optical frequency ν [THz] → Δν [Hz]: Δν = c·Δλ/λ². */
export function wavelengthWidthPmToFrequencyWidthHz(widthPm: number, frequencyThz: number): number {
  requirePositive(frequencyThz, 'frequencyThz');
  if (!Number.isFinite(widthPm) || widthPm < 0) {
    throw new AnalysisInputError(`widthPm must be a finite number >= 0, got ${widthPm}`);
  }
  const lambdaM = SPEED_OF_LIGHT_M_PER_S / (frequencyThz * 1e12);
  return (SPEED_OF_LIGHT_M_PER_S * widthPm * 1e-12) / (lambdaM * lambdaM);
}

/** Photon energy h·ν [J] at ν [THz]. */
export function photonEnergyJ(frequencyThz: number): number {
  requirePositive(frequencyThz, 'frequencyThz');
  return PLANCK_CONSTANT_J_S * frequencyThz * 1e12;
}
