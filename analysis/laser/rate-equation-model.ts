/**
 * The single-mode semiconductor-laser rate-equation model: its parameters with textbook-order defaults,
 * resolved once, the gain and recombination laws, and the deterministic steady state (carriers, photons,
 * output power, spontaneous-emission rate into the mode and the predicted linewidth).
 *
 * Usage:
 *   import { resolveRateEquationParameters, rateEquationSteadyState } from '../analysis/laser/rate-equation-model';
 *   const p = resolveRateEquationParameters({ currentMa: 10 });
 *   const s = rateEquationSteadyState(p);     // s.photons, s.outputPowerMw, s.predictedLinewidthHz, s.thresholdCurrentMa
 *
 * Model (Phaseloom METHODS 6.4, written in carrier number N and photon number P; densities n = N/V,
 * photon density in the active region S = ΓP/V):
 *   dN/dt = η_i I/q − V(A n + B n² + C n³) − G P
 *   dP/dt = (G − 1/τ_p) P + R_sp
 *   dφ/dt = (α/2)(G − 1/τ_p)
 *   G = Γ v_g g(n, S),  g = g₀ ln((n + N_s)/(N_tr + N_s)) / (1 + ε S),  1/τ_p = v_g(α_i + α_m),
 *   R_sp = β_sp B n² V (spontaneous photons per second into the mode),  P_out = hν v_g α_m P (both facets).
 * Predicted linewidth (METHODS 6.4 [derived]; analysis/laser/estimator.ts): Δν = R_sp(1 + α²)/(4πP).
 * Defaults — an illustrative 1.55 µm multi-quantum-well Fabry–Perot laser with textbook-order values after
 * L. A. Coldren, S. W. Corzine, M. L. Mašanović, "Diode Lasers and Photonic Integrated Circuits", 2nd ed.,
 * Wiley (2012) — ALL FROM MEMORY, not verified against the book (METHODS 6.4 and 10):
 *   L = 250 µm, V = 1.2e-11 cm³ (2 µm × 3 × 8 nm wells), Γ = 0.045, n_g = 4.2, α_i = 5 /cm,
 *   R₁ = R₂ = 0.32 (α_m = 45.6 /cm), g₀ = 1800 /cm, N_tr = 1.8e18 cm⁻³, N_s = −0.4e18 cm⁻³,
 *   A = 1e8 /s, B = 0.8e-10 cm³/s, C = 3.5e-30 cm⁶/s, β_sp = 1e-4, ε = 1.5e-17 cm³, η_i = 0.8, α = 4,
 *   λ = 1550 nm, I = 10 mA.
 * Steady state: for a trial N the photon equation fixes P (Brent's root; one positive root since the
 *   photon balance falls from R_sp at P = 0); the carrier balance then fixes N (Brent's root between
 *   n → −N_s and the N whose recombination alone exceeds the pump).
 * Worked check (defaults): threshold ≈ 2.7 mA; at 10 mA about 1e5 photons, ≈ 4 mW out, Δν ≈ 12 MHz.
 */

import { AnalysisInputError } from '../errors';
import { brentRoot } from '../linewidth/brent-root';
import { PLANCK_CONSTANT_J_S, SPEED_OF_LIGHT_M_PER_S } from '../units';
import { phaseDiffusionLinewidthHz } from './estimator';

export interface RateEquationParameters {
  /** drive current, mA */
  currentMa: number;
  wavelengthNm: number;
  cavityLengthUm: number;
  /** active volume V, cm³ */
  activeVolumeCm3: number;
  /** optical confinement factor Γ */
  confinementFactor: number;
  groupIndex: number;
  internalLossPerCm: number;
  /** power reflectivities of the two facets */
  facetReflectivities: [number, number];
  /** gain coefficient g₀, 1/cm */
  gainCoefficientPerCm: number;
  /** transparency density N_tr, cm⁻³ */
  transparencyDensityCm3: number;
  /** gain shift N_s, cm⁻³ (N + N_s must stay > 0) */
  gainShiftDensityCm3: number;
  /** A, 1/s */
  defectRecombinationPerS: number;
  /** B, cm³/s */
  radiativeRecombinationCm3PerS: number;
  /** C, cm⁶/s */
  augerRecombinationCm6PerS: number;
  /** β_sp: fraction of spontaneous emission coupled into the mode */
  spontaneousCoupling: number;
  /** ε, cm³ */
  gainCompressionCm3: number;
  /** η_i */
  injectionEfficiency: number;
  /** α */
  alphaFactor: number;
}

export const DEFAULT_RATE_EQUATION_PARAMETERS: Readonly<RateEquationParameters> = Object.freeze({
  // textbook-order values after Coldren, Corzine & Mašanović (2012) — from memory, not verified
  currentMa: 10,
  wavelengthNm: 1550,
  cavityLengthUm: 250,
  activeVolumeCm3: 1.2e-11,
  confinementFactor: 0.045,
  groupIndex: 4.2,
  internalLossPerCm: 5,
  facetReflectivities: [0.32, 0.32] as [number, number],
  gainCoefficientPerCm: 1800,
  transparencyDensityCm3: 1.8e18,
  gainShiftDensityCm3: -0.4e18,
  defectRecombinationPerS: 1e8,
  radiativeRecombinationCm3PerS: 0.8e-10,
  augerRecombinationCm6PerS: 3.5e-30,
  spontaneousCoupling: 1e-4,
  gainCompressionCm3: 1.5e-17,
  injectionEfficiency: 0.8,
  alphaFactor: 4,
});

/** Derived constants the integrator uses (all SI-consistent in cm and s). */
export interface ResolvedRateEquationParameters extends RateEquationParameters {
  /** v_g, cm/s */
  groupVelocityCmPerS: number;
  mirrorLossPerCm: number;
  /** 1/τ_p, 1/s */
  photonDecayRatePerS: number;
  /** η_i I/q, carriers/s */
  pumpRatePerS: number;
  photonEnergyJ: number;
  /** P_out [mW] per photon in the cavity: hν v_g α_m × 1e3 */
  outputMwPerPhoton: number;
}

const ELEMENTARY_CHARGE_C = 1.602176634e-19; // exact, SI 2019

function positive(v: number, name: string): void {
  if (!(typeof v === 'number' && Number.isFinite(v) && v > 0)) throw new AnalysisInputError(`${name} must be a positive finite number, got ${String(v)}`);
}

export function resolveRateEquationParameters(options: Partial<RateEquationParameters> = {}): ResolvedRateEquationParameters {
  if (options === null || typeof options !== 'object') throw new AnalysisInputError('rate-equation parameters must be an object');
  const known = Object.keys(DEFAULT_RATE_EQUATION_PARAMETERS);
  for (const key of Object.keys(options)) {
    if (!known.includes(key)) throw new AnalysisInputError(`unknown rate-equation parameter '${key}'`);
  }
  const p: RateEquationParameters = { ...DEFAULT_RATE_EQUATION_PARAMETERS, ...options } as RateEquationParameters;
  for (const key of known) {
    if (key === 'facetReflectivities' || key === 'gainShiftDensityCm3' || key === 'alphaFactor') continue;
    positive(p[key as keyof RateEquationParameters] as number, key);
  }
  if (!Number.isFinite(p.alphaFactor)) throw new AnalysisInputError(`alphaFactor must be finite, got ${p.alphaFactor}`);
  if (!Number.isFinite(p.gainShiftDensityCm3) || !(p.transparencyDensityCm3 + p.gainShiftDensityCm3 > 0)) {
    throw new AnalysisInputError(`N_tr + N_s must be > 0, got N_s = ${p.gainShiftDensityCm3}`);
  }
  const r = p.facetReflectivities;
  if (!Array.isArray(r) || r.length !== 2 || !r.every((v) => typeof v === 'number' && v > 0 && v < 1)) {
    throw new AnalysisInputError(`facetReflectivities must be [R1, R2] in (0, 1), got ${JSON.stringify(r)}`);
  }
  if (p.confinementFactor > 1 || p.injectionEfficiency > 1 || p.spontaneousCoupling > 1) {
    throw new AnalysisInputError('confinementFactor, injectionEfficiency and spontaneousCoupling must be <= 1');
  }
  const lengthCm = p.cavityLengthUm * 1e-4;
  const vg = (SPEED_OF_LIGHT_M_PER_S * 100) / p.groupIndex; // v_g = c/n_g, cm/s
  const alphaM = Math.log(1 / (r[0] * r[1])) / (2 * lengthCm); // α_m = ln(1/(R1R2))/(2L)
  const hv = (PLANCK_CONSTANT_J_S * SPEED_OF_LIGHT_M_PER_S) / (p.wavelengthNm * 1e-9);
  return {
    ...p,
    facetReflectivities: [r[0], r[1]],
    groupVelocityCmPerS: vg,
    mirrorLossPerCm: alphaM,
    photonDecayRatePerS: vg * (p.internalLossPerCm + alphaM), // 1/τ_p = v_g(α_i + α_m)
    pumpRatePerS: (p.injectionEfficiency * p.currentMa * 1e-3) / ELEMENTARY_CHARGE_C, // η_i I/q
    photonEnergyJ: hv,
    outputMwPerPhoton: hv * vg * alphaM * 1e3, // P_out = hν v_g α_m P
  };
}

/** G(N, P) = Γ v_g g(n, S), 1/s. */
export function modalGainRate(p: ResolvedRateEquationParameters, carriers: number, photons: number): number {
  const n = carriers / p.activeVolumeCm3;
  const s = (p.confinementFactor * photons) / p.activeVolumeCm3;
  const g = (p.gainCoefficientPerCm * Math.log((n + p.gainShiftDensityCm3) / (p.transparencyDensityCm3 + p.gainShiftDensityCm3))) / (1 + p.gainCompressionCm3 * s);
  return p.confinementFactor * p.groupVelocityCmPerS * g;
}

/** V(A n + B n² + C n³): carriers recombining per second. */
export function recombinationRate(p: ResolvedRateEquationParameters, carriers: number): number {
  const n = carriers / p.activeVolumeCm3;
  return p.activeVolumeCm3 * n * (p.defectRecombinationPerS + n * (p.radiativeRecombinationCm3PerS + n * p.augerRecombinationCm6PerS));
}

/** R_sp = β_sp B n² V: spontaneous photons per second into the mode. */
export function spontaneousRate(p: ResolvedRateEquationParameters, carriers: number): number {
  const n = carriers / p.activeVolumeCm3;
  return p.spontaneousCoupling * p.radiativeRecombinationCm3PerS * n * n * p.activeVolumeCm3;
}

export interface RateEquationSteadyState {
  carriers: number;
  photons: number;
  /** carrier density n, cm⁻³ */
  carrierDensityCm3: number;
  outputPowerMw: number;
  /** R_sp at the steady state, 1/s */
  spontaneousRatePerS: number;
  /** R_sp(1 + α²)/(4πP), Hz */
  predictedLinewidthHz: number;
  /** current where the gain without compression reaches 1/τ_p (spontaneous emission neglected), mA */
  thresholdCurrentMa: number;
  /** small-signal estimate √(G_N P G)/(2π), Hz */
  relaxationFrequencyHz: number;
  photonLifetimeS: number;
}

/** Carriers at which G(N, P) = 1/τ_p (the photon equation without spontaneous emission). */
function clampCarriers(p: ResolvedRateEquationParameters, photons: number): number {
  const s = (p.confinementFactor * photons) / p.activeVolumeCm3;
  const gth = (p.photonDecayRatePerS * (1 + p.gainCompressionCm3 * s)) / (p.confinementFactor * p.groupVelocityCmPerS * p.gainCoefficientPerCm);
  const n = (p.transparencyDensityCm3 + p.gainShiftDensityCm3) * Math.exp(gth) - p.gainShiftDensityCm3;
  return n * p.activeVolumeCm3;
}

/** Photons P(N) > 0 solving the photon equation (G(N, P) − 1/τ_p)P + R_sp(N) = 0 (f(0) = R_sp > 0, f decreasing). */
function photonsFor(p: ResolvedRateEquationParameters, carriers: number): number {
  const rsp = spontaneousRate(p, carriers);
  const f = (P: number) => (modalGainRate(p, carriers, P) - p.photonDecayRatePerS) * P + rsp;
  const g0 = modalGainRate(p, carriers, 0);
  let hi: number;
  if (g0 < p.photonDecayRatePerS) {
    hi = (2 * rsp) / (p.photonDecayRatePerS - g0); // G(N, P) <= G(N, 0): f < 0 beyond R_sp/(1/τ_p − G₀)
  } else {
    hi = Math.max(1, (2 * (g0 / p.photonDecayRatePerS - 1) * p.activeVolumeCm3) / (p.gainCompressionCm3 * p.confinementFactor));
    while (f(hi) >= 0) hi *= 2;
  }
  return brentRoot(f, 0, hi, 1e-13 * hi);
}

/** Deterministic steady state of the model (see the header). */
export function rateEquationSteadyState(p: ResolvedRateEquationParameters): RateEquationSteadyState {
  // carrier balance h(N) = η_i I/q − V R(n) − G P(N): > 0 near n = −N_s, < 0 once recombination alone exceeds the pump
  const balance = (N: number) => p.pumpRatePerS - recombinationRate(p, N) - modalGainRate(p, N, photonsFor(p, N)) * photonsFor(p, N);
  const lo = (-p.gainShiftDensityCm3 + 1e-6 * (p.transparencyDensityCm3 + p.gainShiftDensityCm3)) * p.activeVolumeCm3;
  let hi = Math.max(2 * lo, clampCarriers(p, 0));
  while (recombinationRate(p, hi) <= p.pumpRatePerS) hi *= 1.5;
  if (!(balance(lo) > 0)) throw new AnalysisInputError('the steady state could not be bracketed: check the gain and recombination parameters');
  const carriers = brentRoot(balance, lo, hi, 1e-13 * hi);
  const photons = photonsFor(p, carriers);
  const rsp = spontaneousRate(p, carriers);
  const nth = clampCarriers(p, 0);
  const thresholdCurrentMa = ((recombinationRate(p, nth) * 1.602176634e-19) / p.injectionEfficiency) * 1e3;
  // G_N = ∂G/∂N by a central difference
  const h = 1e-6 * carriers;
  const gN = (modalGainRate(p, carriers + h, photons) - modalGainRate(p, carriers - h, photons)) / (2 * h);
  const G = modalGainRate(p, carriers, photons);
  return {
    carriers,
    photons,
    carrierDensityCm3: carriers / p.activeVolumeCm3,
    outputPowerMw: photons * p.outputMwPerPhoton,
    spontaneousRatePerS: rsp,
    predictedLinewidthHz: phaseDiffusionLinewidthHz(rsp, photons, p.alphaFactor),
    thresholdCurrentMa,
    relaxationFrequencyHz: Math.sqrt(Math.max(0, gN * photons * G)) / (2 * Math.PI),
    photonLifetimeS: 1 / p.photonDecayRatePerS,
  };
}
