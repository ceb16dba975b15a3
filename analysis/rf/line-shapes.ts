/**
 * Line shapes of an RF beat spectrum, each parameterised by its full width at half maximum (FWHM):
 * Lorentzian, Gaussian and Voigt (their convolution), peak-normalised for fitting and area-normalised
 * as scipy.special.voigt_profile.
 *
 * Usage:
 *   import { lorentzianShape, gaussianShape, voigtShape, voigtProfile } from '../analysis/rf/line-shapes';
 *   lorentzianShape(offsetHz, fwhmHz);               // 1 at the centre, ½ at ±FWHM/2
 *   voigtShape(offsetHz, lorentzianFwhmHz, gaussianFwhmHz);
 *   voigtProfile(x, sigma, gamma);                   // area 1, as scipy.special.voigt_profile
 *
 * Definitions (Phaseloom METHODS 4.4), offset x = f − f0 [Hz], widths in Hz:
 *   Lorentzian  (w/2)² / (x² + (w/2)²)
 *   Gaussian    exp(−4 ln2 · x²/w²)
 *   Voigt       V(x; σ, γ) = Re w(z)/(σ√(2π)), z = (x + iγ)/(σ√2), γ = f_L/2, σ = f_G/(2√(2 ln 2)),
 *               w the Faddeeva function (analysis/rf/faddeeva.ts, Weideman 1994); peak-normalised form
 *               V(x)/V(0), V(0) = Re w(iγ/(σ√2))/(σ√(2π)).
 * Limits: f_G = 0 gives the Lorentzian, f_L = 0 the Gaussian (evaluated in closed form).
 * Reference for the Voigt profile: B. H. Armstrong, "Spectrum line profiles: the Voigt function",
 *   J. Quant. Spectrosc. Radiat. Transfer 7, 61-88 (1967) (from memory).
 * Worked check: voigtProfile(0, 1, 1) = Re w(i/√2)/√(2π) = 0.20870928052036 (scipy.special.voigt_profile).
 */

import { faddeeva, type Complex } from './faddeeva';

/** 2√(2 ln 2): FWHM = this × σ for a Gaussian */
export const GAUSSIAN_FWHM_PER_SIGMA = 2 * Math.sqrt(2 * Math.LN2);
const SQRT_2PI = Math.sqrt(2 * Math.PI);
const scratch: Complex = { re: 0, im: 0 };

/** Peak-normalised Lorentzian of FWHM w at offset x. */
export function lorentzianShape(offsetHz: number, fwhmHz: number): number {
  const h = fwhmHz / 2;
  return (h * h) / (offsetHz * offsetHz + h * h);
}

/** Peak-normalised Gaussian of FWHM w at offset x. */
export function gaussianShape(offsetHz: number, fwhmHz: number): number {
  return Math.exp((-4 * Math.LN2 * offsetHz * offsetHz) / (fwhmHz * fwhmHz));
}

/** Area-normalised Voigt profile V(x; σ, γ), as scipy.special.voigt_profile. */
export function voigtProfile(x: number, sigma: number, gamma: number): number {
  if (sigma === 0) return gamma / (Math.PI * (x * x + gamma * gamma));
  if (gamma === 0) return Math.exp(-(x * x) / (2 * sigma * sigma)) / (sigma * SQRT_2PI);
  const s = sigma * Math.SQRT2;
  faddeeva(Math.abs(x) / s, gamma / s, scratch);
  return scratch.re / (sigma * SQRT_2PI);
}

/** σ and γ of a Voigt line from its Lorentzian and Gaussian FWHMs. */
export function voigtSigmaGamma(lorentzianFwhmHz: number, gaussianFwhmHz: number): { sigma: number; gamma: number } {
  return { sigma: gaussianFwhmHz / GAUSSIAN_FWHM_PER_SIGMA, gamma: lorentzianFwhmHz / 2 };
}

/** Peak-normalised Voigt line V(x)/V(0) from its Lorentzian and Gaussian FWHMs. */
export function voigtShape(offsetHz: number, lorentzianFwhmHz: number, gaussianFwhmHz: number): number {
  if (gaussianFwhmHz === 0) return lorentzianShape(offsetHz, lorentzianFwhmHz);
  if (lorentzianFwhmHz === 0) return gaussianShape(offsetHz, gaussianFwhmHz);
  const { sigma, gamma } = voigtSigmaGamma(lorentzianFwhmHz, gaussianFwhmHz);
  return voigtProfile(offsetHz, sigma, gamma) / voigtProfile(0, sigma, gamma);
}
