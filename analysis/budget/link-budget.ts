/**
 * Phase-noise link budget of a coherent link: combined linewidth of transmitter and local oscillator,
 * Δν·T_s against the published tolerance of the format, the margin as a factor and in dB, a verdict, and
 * the residual phase error after carrier recovery from the measured S_ν; and the same across symbol rates.
 *
 * Usage:
 *   import { evaluateLinkBudget, linkBudgetTable } from '../analysis/budget/link-budget';
 *   evaluateLinkBudget({ format: '16QAM', symbolRateBaud: 32e9, linewidthHz: 200e3 });
 *   evaluateLinkBudget({ format: '64QAM', symbolRateBaud: 64e9,
 *     transmitter: { spectrum: txSpectrum, tailLevelHz2PerHz: 3e3 }, localOscillator: { linewidthHz: 50e3 },
 *     carrierRecovery: { kind: 'block-average', blockLength: 21 } });
 *   linkBudgetTable({ format: 'QPSK', linewidthHz: 1e6 }, [8e9, 16e9, 32e9]);
 *
 * Method (Phaseloom METHODS 4.1, 7.1-7.3):
 *   Lorentzian lasers: Δν = Δν_Tx + Δν_LO (Lorentzian FWHMs add: the beat phase is φ_Tx − φ_LO);
 *     σ_p² = 2πΔνT_s per symbol (Wiener phase).
 *   A laser given as a spectrum: S_ν,tot = S_ν,Tx + S_ν,LO (a linewidth adds the white level Δν/π); with a
 *     carrier-recovery model the residual σ_e² = ∫ S_φ,tot|1 − H|² df and the equivalent Wiener linewidth
 *     Δν_eq (analysis/budget/carrier-recovery.ts); Δν_eq is then the combined linewidth of the budget
 *     (low-frequency noise that the estimator tracks does not count).
 *   Δν·T_s = Δν/R_s; tolerance from analysis/budget/tolerances.ts; margin factor = tolerance/(Δν·T_s),
 *     margin dB = 10·log₁₀(factor); pass when factor ≥ 1.
 *   Formats without a verified tolerance (8PSK, 32QAM): toleranceProduct, margin and pass are null and the
 *     verdict says why — no number is invented.
 * Defaults: table symbol rates 8, 16, 32, 64, 96, 128 GBd (common practice, no source).
 * Worked check: 16QAM at 32 GBd, Δν = 200 kHz → Δν·T_s = 6.25e-6, margin 22.4 (13.50 dB), pass.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';
import { type CarrierRecovery, residualPhaseError, resolveCarrierRecovery } from './carrier-recovery';
import { type FrequencyNoise, frequencyNoise } from './phase-noise-integral';
import { type ModulationFormat, publishedTolerance } from './tolerances';

export type LaserNoise = { linewidthHz: number } | { spectrum: Spectrum; tailLevelHz2PerHz?: number };

export interface LinkBudgetInput {
  format: ModulationFormat;
  symbolRateBaud: number;
  /** the combined (Tx + LO) Lorentzian linewidth, Hz; or give transmitter and localOscillator */
  linewidthHz?: number;
  transmitter?: LaserNoise;
  localOscillator?: LaserNoise;
  carrierRecovery?: CarrierRecovery;
}

export interface LinkBudgetResult {
  format: ModulationFormat;
  symbolRateBaud: number;
  /** Δν of the budget, Hz: the Lorentzian sum, or the equivalent Wiener linewidth when a spectrum is given */
  combinedLinewidthHz: number;
  linewidthBasis: 'lorentzian-sum' | 'equivalent-wiener';
  /** Δν·T_s */
  linewidthSymbolProduct: number;
  toleranceProduct: number | null;
  toleranceSource: string;
  toleranceCriterion: string | null;
  marginFactor: number | null;
  marginDb: number | null;
  pass: boolean | null;
  verdict: string;
  caution: string;
  /** σ_p² = 2πΔνT_s, rad² (Wiener increment per symbol at the combined linewidth) */
  phaseIncrementVarianceRad2: number;
  /** σ_e² after carrier recovery (when a carrier-recovery model is given), rad² */
  residualPhaseErrorRad2?: number;
  /** Δν_eq: the Lorentzian linewidth leaving the same σ_e² with this estimator (with a carrier-recovery model), Hz */
  equivalentWienerLinewidthHz?: number;
  carrierRecovery?: CarrierRecovery;
  warnings: string[];
}

export const DEFAULT_TABLE_SYMBOL_RATES_BAUD: readonly number[] = [8e9, 16e9, 32e9, 64e9, 96e9, 128e9];
export const BUDGET_CAUTION =
  'A link budget is an estimate: the tolerance holds for one carrier-recovery algorithm and criterion, and ignores ' +
  'other impairments (additive noise, cycle slips, equaliser interaction) — confirm it on the link.';

interface ResolvedBudget {
  format: ModulationFormat;
  symbolRateBaud: number;
  /** Σ Lorentzian linewidths given as numbers */
  lorentzianSumHz: number;
  noise: FrequencyNoise | null;
  hasSpectrum: boolean;
  carrierRecovery: CarrierRecovery | null;
}

function laserPart(laser: LaserNoise, name: string): { linewidthHz: number } | { spectrum: Spectrum; tailLevelHz2PerHz?: number } {
  if (!laser || typeof laser !== 'object') throw new AnalysisInputError(`${name} must be { linewidthHz } or { spectrum }`, name);
  if ('linewidthHz' in laser && 'spectrum' in laser) throw new AnalysisInputError(`${name}: give linewidthHz or spectrum, not both`, name);
  if ('linewidthHz' in laser) {
    const v = laser.linewidthHz;
    if (!(typeof v === 'number' && Number.isFinite(v) && v >= 0)) {
      throw new AnalysisInputError(`the linewidth must be a finite number of Hz >= 0, got ${String(v)}`, `${name}.linewidthHz`);
    }
    return { linewidthHz: v };
  }
  if ('spectrum' in laser) return laser;
  throw new AnalysisInputError(`${name} must be { linewidthHz } or { spectrum }`, name);
}

function resolveBudget(input: LinkBudgetInput, symbolRateBaud: number): ResolvedBudget {
  if (!input || typeof input !== 'object') throw new AnalysisInputError('the link budget needs format, symbolRateBaud and the lasers');
  publishedTolerance(input.format); // checks the format
  if (!(typeof symbolRateBaud === 'number' && Number.isFinite(symbolRateBaud) && symbolRateBaud > 0)) {
    throw new AnalysisInputError(`the symbol rate must be a positive number of baud, got ${String(symbolRateBaud)}`, 'symbolRateBaud');
  }
  const recovery = input.carrierRecovery === undefined ? null : resolveCarrierRecovery(input.carrierRecovery, symbolRateBaud);
  const hasPair = input.transmitter !== undefined || input.localOscillator !== undefined;
  if (input.linewidthHz !== undefined && hasPair) {
    throw new AnalysisInputError('give linewidthHz (combined) or transmitter and localOscillator, not both', 'linewidthHz');
  }
  let lorentzianSum = 0;
  const spectra: { spectrum: Spectrum; tailLevelHz2PerHz?: number }[] = [];
  if (input.linewidthHz !== undefined) {
    const v = input.linewidthHz;
    if (!(typeof v === 'number' && Number.isFinite(v) && v >= 0)) {
      throw new AnalysisInputError(`the linewidth must be a finite number of Hz >= 0, got ${String(v)}`, 'linewidthHz');
    }
    lorentzianSum = v;
  } else if (hasPair) {
    if (input.transmitter === undefined || input.localOscillator === undefined) {
      throw new AnalysisInputError('give both transmitter and localOscillator (each { linewidthHz } or a spectrum)', input.transmitter === undefined ? 'transmitter' : 'localOscillator');
    }
    for (const [laser, name] of [[input.transmitter, 'transmitter'], [input.localOscillator, 'localOscillator']] as const) {
      const part = laserPart(laser, name);
      if ('linewidthHz' in part) lorentzianSum += part.linewidthHz;
      else spectra.push({ spectrum: part.spectrum, tailLevelHz2PerHz: part.tailLevelHz2PerHz });
    }
  } else {
    throw new AnalysisInputError('give linewidthHz (combined) or transmitter and localOscillator', 'linewidthHz');
  }
  const hasSpectrum = spectra.length > 0;
  if (hasSpectrum && recovery === null) {
    throw new AnalysisInputError(
      'a laser given as a spectrum needs a carrier-recovery model (block-average or first-order-loop) to turn its noise into an equivalent Wiener linewidth',
      'carrierRecovery',
    );
  }
  // Lorentzian lasers add their white level h₀ = Δν/π (Δν = π·S_ν,white)
  const noise = hasSpectrum || (recovery !== null && lorentzianSum > 0) ? frequencyNoise({ spectra, whiteHz2PerHz: lorentzianSum / Math.PI }) : null;
  return { format: input.format, symbolRateBaud, lorentzianSumHz: lorentzianSum, noise, hasSpectrum, carrierRecovery: recovery };
}

function evaluate(r: ResolvedBudget): LinkBudgetResult {
  const warnings: string[] = [];
  let combined = r.lorentzianSumHz;
  let residual: number | undefined;
  let equivalent: number | undefined;
  if (r.carrierRecovery !== null) {
    if (r.noise === null) {
      residual = 0; // no phase noise at all
      equivalent = 0;
    } else {
      const e = residualPhaseError(r.noise, r.carrierRecovery, r.symbolRateBaud);
      residual = e.varianceRad2;
      equivalent = e.equivalentLinewidthHz;
      if (r.hasSpectrum) combined = e.equivalentLinewidthHz;
    }
  }
  const ts = 1 / r.symbolRateBaud;
  const product = combined * ts; // Δν·T_s
  const tol = publishedTolerance(r.format);
  let marginFactor: number | null = null;
  let marginDb: number | null = null;
  let pass: boolean | null = null;
  let verdict: string;
  if (tol.product === null) {
    verdict = `${tol.source}: no verdict (Δν·T_s = ${product.toExponential(3)})`;
  } else if (product === 0) {
    marginFactor = Infinity;
    marginDb = Infinity;
    pass = true;
    verdict = 'no phase noise: within the tolerance';
  } else {
    marginFactor = tol.product / product; // tolerance/(Δν·T_s)
    marginDb = 10 * Math.log10(marginFactor);
    pass = marginFactor >= 1;
    verdict = pass
      ? `within the published tolerance by ${marginDb.toFixed(2)} dB (×${marginFactor.toPrecision(3)})`
      : `exceeds the published tolerance by ${(-marginDb).toFixed(2)} dB (×${(1 / marginFactor).toPrecision(3)})`;
    if (pass && marginDb < 3) warnings.push('less than 3 dB of margin: small changes in the lasers or the algorithm can use it up');
  }
  return {
    format: r.format,
    symbolRateBaud: r.symbolRateBaud,
    combinedLinewidthHz: combined,
    linewidthBasis: r.hasSpectrum ? 'equivalent-wiener' : 'lorentzian-sum',
    linewidthSymbolProduct: product,
    toleranceProduct: tol.product,
    toleranceSource: tol.source,
    toleranceCriterion: tol.criterion,
    marginFactor,
    marginDb,
    pass,
    verdict,
    caution: BUDGET_CAUTION,
    phaseIncrementVarianceRad2: 2 * Math.PI * product, // σ_p² = 2πΔνT_s
    ...(residual !== undefined
      ? { residualPhaseErrorRad2: residual, equivalentWienerLinewidthHz: equivalent, carrierRecovery: r.carrierRecovery as CarrierRecovery }
      : {}),
    warnings,
  };
}

/** The budget at one symbol rate (see the header). */
export function evaluateLinkBudget(input: LinkBudgetInput): LinkBudgetResult {
  return evaluate(resolveBudget(input, input?.symbolRateBaud));
}

/** The budget across symbol rates (default 8 … 128 GBd); the estimator's block length or loop bandwidth is kept fixed. */
export function linkBudgetTable(input: Omit<LinkBudgetInput, 'symbolRateBaud'>, symbolRatesBaud: readonly number[] = DEFAULT_TABLE_SYMBOL_RATES_BAUD): LinkBudgetResult[] {
  if (!Array.isArray(symbolRatesBaud) || symbolRatesBaud.length === 0 || symbolRatesBaud.length > 64) {
    throw new AnalysisInputError('symbolRatesBaud must list 1 to 64 symbol rates', 'symbolRatesBaud');
  }
  return symbolRatesBaud.map((rs) => evaluate(resolveBudget(input as LinkBudgetInput, rs)));
}
