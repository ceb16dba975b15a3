/**
 * Residual phase-error variance after carrier recovery, computed from a measured frequency-noise PSD,
 * and the equivalent Wiener (Lorentzian) linewidth that would leave the same error.
 *
 * Usage:
 *   import { residualPhaseError } from '../analysis/budget/carrier-recovery';
 *   const noise = frequencyNoise({ spectra: [{ spectrum: tx }, { spectrum: lo }] });
 *   const r = residualPhaseError(noise, { kind: 'block-average', blockLength: 21 }, 32e9);
 *   r.varianceRad2; r.equivalentLinewidthHz
 *   residualPhaseError(noise, { kind: 'first-order-loop', bandwidthHz: 100e6 }, 32e9);
 *
 * Model (Phaseloom METHODS 7.3): the phase estimator is a linear filter H(f) on the laser phase; with the
 * one-sided S_φ,tot = (S_ν,Tx + S_ν,LO)/f²,  σ_e² = ∫₀^∞ S_φ,tot(f) |1 − H(f)|² df  (additive noise not included).
 *   feed-forward block estimator: the centred moving average of M = 2L+1 symbol phases,
 *     H(f) = sin(πfMT_s)/(M sin(πfT_s)), periodic in R_s = 1/T_s (aliasing included by folding);
 *   first-order tracking loop of bandwidth f_c: H(f) = 1/(1 + i f/f_c), |1 − H|² = f²/(f_c² + f²)
 *     (noise bandwidth B_L = πf_c/2, one-sided).
 * Closed forms for white frequency noise h₀ = Δν/π [derived in METHODS 7.3]:
 *   block average σ_e² = σ_p² L(L+1)/(3(2L+1)), σ_p² = 2πΔνT_s;   loop σ_e² = πh₀/(2f_c) = Δν/(2f_c).
 * Equivalent Wiener linewidth Δν_eq: the Lorentzian linewidth giving the same σ_e² with the same estimator
 *   (σ_e² is linear in h₀, so Δν_eq = σ_e²/σ_e²(Δν = 1 Hz), the latter by the same quadrature). Compare
 *   Δν_eq·T_s with the published tolerances: low-frequency (1/f) noise is tracked by the estimator, so a
 *   β-line linewidth dominated by it is the wrong metric for DSP tolerance (METHODS 7.3).
 * Quadrature: analysis/budget/phase-noise-integral.ts. Defaults: none (the estimator must be stated).
 * Worked check: Δν = 100 kHz, R_s = 32 GBd, M = 21 → 3.4283e-5 rad² (METHODS 7.3); loop, h₀ = 1e5/π,
 *   f_c = 100 MHz → 5.0000e-4 rad².
 */

import { AnalysisInputError } from '../errors';
import { type FrequencyNoise, type PhaseErrorWeight, frequencyNoise, integratePhaseError } from './phase-noise-integral';

export type CarrierRecovery =
  | { kind: 'block-average'; /** M symbols, odd (centred on the symbol) */ blockLength: number }
  | { kind: 'first-order-loop'; /** f_c, Hz */ bandwidthHz: number };

export interface ResidualPhaseError {
  /** σ_e², rad² */
  varianceRad2: number;
  /** Δν_eq, Hz */
  equivalentLinewidthHz: number;
  /** σ_e² for a 1 Hz Lorentzian pair with this estimator, rad²/Hz */
  variancePerHz: number;
}

export const MAX_BLOCK_LENGTH = 100_001;

/** Checks the estimator; throws AnalysisInputError naming the rule. */
export function resolveCarrierRecovery(recovery: CarrierRecovery, symbolRateBaud: number): CarrierRecovery {
  if (!(typeof symbolRateBaud === 'number' && Number.isFinite(symbolRateBaud) && symbolRateBaud > 0)) {
    throw new AnalysisInputError(`the symbol rate must be a positive number of baud, got ${String(symbolRateBaud)}`, 'symbolRateBaud');
  }
  if (!recovery || typeof recovery !== 'object') throw new AnalysisInputError('carrierRecovery must be an object with kind');
  if (recovery.kind === 'block-average') {
    const m = recovery.blockLength;
    if (!(Number.isInteger(m) && m >= 1 && m <= MAX_BLOCK_LENGTH && m % 2 === 1)) {
      throw new AnalysisInputError(`the block length must be an odd integer in [1, ${MAX_BLOCK_LENGTH}] (a centred average over 2L+1 symbols), got ${String(m)}`, 'carrierRecovery.blockLength');
    }
    return { kind: 'block-average', blockLength: m };
  }
  if (recovery.kind === 'first-order-loop') {
    const fc = recovery.bandwidthHz;
    if (!(typeof fc === 'number' && Number.isFinite(fc) && fc > 0)) {
      throw new AnalysisInputError(`the loop bandwidth must be a positive number of Hz, got ${String(fc)}`, 'carrierRecovery.bandwidthHz');
    }
    return { kind: 'first-order-loop', bandwidthHz: fc };
  }
  throw new AnalysisInputError(`carrierRecovery.kind must be 'block-average' or 'first-order-loop', got ${String((recovery as { kind?: unknown }).kind)}`);
}

/** |1 − H|² of the centred moving average over M symbols. */
export function blockAverageWeight(blockLength: number, symbolRateBaud: number): PhaseErrorWeight {
  const m = blockLength;
  const ts = 1 / symbolRateBaud;
  const breakpointsHz: number[] = [];
  for (let j = 1; j < m; j++) breakpointsHz.push((j * symbolRateBaud) / m);
  const c = ((Math.PI * ts) ** 2 * (m * m - 1)) / 6; // 1 − H ≈ (πfT_s)²(M² − 1)/6
  return {
    at: (f) => {
      const d = Math.sin(Math.PI * f * ts);
      const h = d === 0 ? 1 : Math.sin(Math.PI * f * m * ts) / (m * d); // H = sin(πfMT_s)/(M sin(πfT_s))
      return (1 - h) * (1 - h);
    },
    periodHz: symbolRateBaud,
    breakpointsHz,
    maxPieceHz: symbolRateBaud / (16 * m),
    meanOverPeriod: 1 - 1 / m, // ⟨(1 − H)²⟩ = 1 − 2⟨H⟩ + ⟨H²⟩ = 1 − 2/M + 1/M (Parseval)
    lowCoefficient: c * c,
    lowPower: 4,
  };
}

/** |1 − H|² = f²/(f_c² + f²) of the first-order loop. */
export function firstOrderLoopWeight(bandwidthHz: number): PhaseErrorWeight {
  const fc = bandwidthHz;
  return {
    at: (f) => (f * f) / (fc * fc + f * f),
    periodHz: null,
    breakpointsHz: [fc],
    maxPieceHz: Infinity,
    lowCoefficient: 1 / (fc * fc),
    lowPower: 2,
    // ∫_F^∞ 1/(f_c² + f²) df = (π/2 − atan(F/f_c))/f_c
    tailIntegral: (from) => (Math.PI / 2 - Math.atan(from / fc)) / fc,
  };
}

function weightFor(recovery: CarrierRecovery, symbolRateBaud: number): PhaseErrorWeight {
  return recovery.kind === 'block-average' ? blockAverageWeight(recovery.blockLength, symbolRateBaud) : firstOrderLoopWeight(recovery.bandwidthHz);
}

/** σ_e² and Δν_eq for the given frequency noise, estimator and symbol rate. */
export function residualPhaseError(noise: FrequencyNoise, recovery: CarrierRecovery, symbolRateBaud: number): ResidualPhaseError {
  const r = resolveCarrierRecovery(recovery, symbolRateBaud);
  const weight = weightFor(r, symbolRateBaud);
  const variance = integratePhaseError(noise, weight);
  // the same estimator on a 1 Hz Lorentzian pair (h₀ = 1/π), by the same quadrature
  const perHz = integratePhaseError(frequencyNoise({ whiteHz2PerHz: 1 / Math.PI }), weight);
  return { varianceRad2: variance, equivalentLinewidthHz: variance / perHz, variancePerHz: perHz };
}

/** Closed forms for a Lorentzian pair of summed FWHM Δν (METHODS 7.3 [derived]), rad². */
export function residualPhaseErrorLorentzian(linewidthHz: number, recovery: CarrierRecovery, symbolRateBaud: number): number {
  const r = resolveCarrierRecovery(recovery, symbolRateBaud);
  if (!(Number.isFinite(linewidthHz) && linewidthHz >= 0)) throw new AnalysisInputError(`linewidthHz must be >= 0, got ${linewidthHz}`);
  if (r.kind === 'block-average') {
    const L = (r.blockLength - 1) / 2;
    const sigmaP2 = (2 * Math.PI * linewidthHz) / symbolRateBaud; // σ_p² = 2πΔνT_s
    return (sigmaP2 * L * (L + 1)) / (3 * (2 * L + 1));
  }
  return linewidthHz / (2 * r.bandwidthHz); // πh₀/(2f_c) with h₀ = Δν/π
}
