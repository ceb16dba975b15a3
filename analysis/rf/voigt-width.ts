/**
 * FWHM of a Voigt line from its Lorentzian and Gaussian FWHMs: the Olivero–Longbothum approximation
 * (what Phaseloom reports), the exact value (half maximum found by root search) and the
 * Thompson–Cox–Hastings pseudo-Voigt width (for comparison).
 *
 * Usage:
 *   import { voigtFwhmOliveroLongbothum, voigtFwhmExact } from '../analysis/rf/voigt-width';
 *   voigtFwhmOliveroLongbothum(1, 1);   // 1.637596
 *   voigtFwhmExact(1, 1);               // 1.637595
 *
 * Formulas (Phaseloom METHODS 4.4), widths in any one unit (Hz):
 *   Olivero & Longbothum, "Empirical fits to the Voigt line width: a brief review", J. Quant. Spectrosc.
 *   Radiat. Transfer 17, 233 (1977) (coefficients from memory; checked numerically in METHODS: max
 *   relative error 2.4e-4 over f_L/f_G = 1e-3…1e3):  f_V ≈ 0.5346 f_L + √(0.2166 f_L² + f_G²).
 *   Exact: f_V = 2x with V(x) = V(0)/2 (analysis/rf/line-shapes.ts; Brent's root, tolerance 1e-13 relative),
 *   bracketed by the Olivero–Longbothum value ± 1 %.
 *   Thompson, Cox, Hastings, J. Appl. Cryst. 20, 79 (1987):
 *   f = (f_G⁵ + 2.69269 f_G⁴f_L + 2.42843 f_G³f_L² + 4.47163 f_G²f_L³ + 0.07842 f_G f_L⁴ + f_L⁵)^{1/5}.
 * Worked check: f_L = f_G = 1 → exact 1.637595, OL 1.637596, TCH 1.634643 (METHODS 4.4).
 */

import { AnalysisInputError } from '../errors';
import { brentRoot } from '../linewidth/brent-root';
import { voigtProfile, voigtSigmaGamma } from './line-shapes';

function checkWidths(fl: number, fg: number): void {
  if (!(Number.isFinite(fl) && fl >= 0 && Number.isFinite(fg) && fg >= 0 && fl + fg > 0)) {
    throw new AnalysisInputError(`Voigt widths must be finite, >= 0 and not both 0, got fL = ${fl}, fG = ${fg}`);
  }
}

/** f_V ≈ 0.5346 f_L + √(0.2166 f_L² + f_G²) (Olivero & Longbothum 1977). */
export function voigtFwhmOliveroLongbothum(lorentzianFwhm: number, gaussianFwhm: number): number {
  checkWidths(lorentzianFwhm, gaussianFwhm);
  return 0.5346 * lorentzianFwhm + Math.sqrt(0.2166 * lorentzianFwhm * lorentzianFwhm + gaussianFwhm * gaussianFwhm);
}

/** ∂f_V/∂f_L and ∂f_V/∂f_G of the Olivero–Longbothum formula (for propagating fit uncertainties). */
export function voigtFwhmOliveroLongbothumGradient(lorentzianFwhm: number, gaussianFwhm: number): [number, number] {
  const r = Math.sqrt(0.2166 * lorentzianFwhm * lorentzianFwhm + gaussianFwhm * gaussianFwhm);
  return [0.5346 + (0.2166 * lorentzianFwhm) / r, gaussianFwhm / r];
}

/** Exact Voigt FWHM by root search on the profile. */
export function voigtFwhmExact(lorentzianFwhm: number, gaussianFwhm: number): number {
  const approx = voigtFwhmOliveroLongbothum(lorentzianFwhm, gaussianFwhm);
  if (gaussianFwhm === 0 || lorentzianFwhm === 0) return lorentzianFwhm + gaussianFwhm;
  const { sigma, gamma } = voigtSigmaGamma(lorentzianFwhm, gaussianFwhm);
  const half = voigtProfile(0, sigma, gamma) / 2;
  const x = brentRoot((t) => voigtProfile(t, sigma, gamma) - half, 0.495 * approx, 0.505 * approx, 1e-13 * approx);
  return 2 * x;
}

/** Pseudo-Voigt FWHM of Thompson, Cox & Hastings (1987). */
export function voigtFwhmThompsonCoxHastings(lorentzianFwhm: number, gaussianFwhm: number): number {
  checkWidths(lorentzianFwhm, gaussianFwhm);
  const g = gaussianFwhm;
  const l = lorentzianFwhm;
  return Math.pow(
    g ** 5 + 2.69269 * g ** 4 * l + 2.42843 * g ** 3 * l ** 2 + 4.47163 * g ** 2 * l ** 3 + 0.07842 * g * l ** 4 + l ** 5,
    0.2,
  );
}
