/**
 * Laser linewidth predicted from the cavity: cold-cavity linewidth, the (modified) Schawlow–Townes
 * linewidth and Henry's α-enhanced linewidth, from a Fabry–Perot description of the laser.
 *
 * Usage:
 *   import { estimateLaserLinewidth, phaseDiffusionLinewidthHz } from '../analysis/laser/estimator';
 *   const e = estimateLaserLinewidth({ wavelengthNm: 1550, groupIndex: 3.6, cavityLengthUm: 400,
 *     facetReflectivities: [0.3, 0.3], internalLossPerCm: 10, nsp: 2, alphaFactor: 4, outputPowerMw: 1 });
 *   e.coldCavityLinewidthHz; e.schawlowTownesLinewidthHz; e.enhancedLinewidthHz   // 53.15 GHz, 0.854 MHz, 14.51 MHz
 *   phaseDiffusionLinewidthHz(rSpPerS, photons, alpha);                             // R_sp(1+α²)/(4πP)
 *
 * Formulas (Phaseloom METHODS 6.1; C. H. Henry, "Theory of the linewidth of semiconductor lasers", IEEE J.
 * Quantum Electron. QE-18(2), 259-264 (1982) — details from memory):
 *   ν = c/λ, v_g = c/n_g, α_m = ln(1/(R₁R₂))/(2L) (or given), g_th = α_i + α_m (modal threshold gain),
 *   cold cavity (photon decay rate v_g g_th):  Δν_c = v_g g_th/(2π)
 *   optical efficiency η₀ = α_m/g_th;  output through both facets P_out = P₁/F₁, with the share of facet 1
 *   F₁ = (1−R₁)√R₂ / ((1−R₁)√R₂ + (1−R₂)√R₁) (Fabry–Perot with unequal facets; L. A. Coldren, S. W. Corzine,
 *   M. L. Mašanović, "Diode Lasers and Photonic Integrated Circuits", 2nd ed., Wiley (2012) — from memory);
 *   ½ when the mirror loss is given instead of the reflectivities.
 *   Schawlow–Townes (α = 0):   Δν_ST = π hν Δν_c² n_sp η₀ / P_out
 *   Henry (α-enhanced):        Δν = Δν_ST (1 + α²)
 *   Photon number in the cavity N_ph = P_out/(hν v_g α_m); in that form Δν = v_g g_th n_sp (1+α²)/(4π N_ph),
 *   which is R_sp(1+α²)/(4πP) with R_sp = v_g g_th n_sp (METHODS 6.4).
 * Constants exact (SI 2019): c = 299 792 458 m/s, h = 6.626 070 15e-34 J·s (analysis/units.ts).
 * Units: nm, µm, 1/cm, mW in; Hz, J, m/s, 1/cm out.
 * Worked check: λ = 1550 nm, n_g = 3.6, α_i = 10/cm, α_m = 30.1/cm, n_sp = 2, α = 4, 1 mW per facet
 * (symmetric) → Δν_c = 53.15 GHz, η₀ = 0.751, Δν = 14.51 MHz (METHODS 6.1).
 */

import { AnalysisInputError } from '../errors';
import { PLANCK_CONSTANT_J_S, SPEED_OF_LIGHT_M_PER_S } from '../units';

export interface LaserEstimateInput {
  wavelengthNm: number;
  groupIndex: number;
  cavityLengthUm: number;
  /** power reflectivities [R₁, R₂] of the facets (R₁: the output facet whose power is given) */
  facetReflectivities?: [number, number];
  /** or the distributed mirror loss α_m, 1/cm (facets taken as equal: each carries half the output) */
  mirrorLossPerCm?: number;
  internalLossPerCm: number;
  /** population-inversion (spontaneous-emission) factor n_sp ≥ 1 */
  nsp: number;
  /** linewidth-enhancement factor α */
  alphaFactor: number;
  /** power out of facet 1, mW */
  outputPowerMw: number;
}

export interface LaserEstimate {
  coldCavityLinewidthHz: number;
  schawlowTownesLinewidthHz: number;
  enhancedLinewidthHz: number;
  opticalFrequencyHz: number;
  photonEnergyJ: number;
  groupVelocityMPerS: number;
  mirrorLossPerCm: number;
  thresholdGainPerCm: number;
  /** η₀ = α_m/g_th */
  opticalEfficiency: number;
  /** 1/(v_g g_th), s */
  photonLifetimeS: number;
  /** share of the output leaving through facet 1 */
  outputFacetShare: number;
  totalOutputPowerMw: number;
  /** photons in the cavity, N_ph = P_out/(hν v_g α_m) */
  photonNumber: number;
  assumptions: string[];
}

function positive(v: unknown, name: string): number {
  if (!(typeof v === 'number' && Number.isFinite(v) && v > 0)) {
    throw new AnalysisInputError(`${name} must be a positive finite number, got ${String(v)}`);
  }
  return v;
}

/** Δν = R_sp(1 + α²)/(4π P): the phase-diffusion linewidth for R_sp spontaneous photons/s into a mode holding P photons (METHODS 6.4). */
export function phaseDiffusionLinewidthHz(spontaneousRatePerS: number, photonNumber: number, alphaFactor: number): number {
  positive(spontaneousRatePerS, 'spontaneousRatePerS');
  positive(photonNumber, 'photonNumber');
  if (!Number.isFinite(alphaFactor)) throw new AnalysisInputError(`alphaFactor must be finite, got ${alphaFactor}`);
  return (spontaneousRatePerS * (1 + alphaFactor * alphaFactor)) / (4 * Math.PI * photonNumber);
}

/** The cavity form π hν Δν_c² n_sp (1+α²) η₀ / P_out (METHODS 6.1), all in SI (Hz, W). */
export function cavityFormLinewidthHz(o: {
  opticalFrequencyHz: number;
  coldCavityLinewidthHz: number;
  nsp: number;
  alphaFactor: number;
  opticalEfficiency: number;
  totalOutputPowerW: number;
}): number {
  const hv = PLANCK_CONSTANT_J_S * positive(o.opticalFrequencyHz, 'opticalFrequencyHz');
  const dc = positive(o.coldCavityLinewidthHz, 'coldCavityLinewidthHz');
  return (Math.PI * hv * dc * dc * positive(o.nsp, 'nsp') * (1 + o.alphaFactor * o.alphaFactor) * positive(o.opticalEfficiency, 'opticalEfficiency')) /
    positive(o.totalOutputPowerW, 'totalOutputPowerW');
}

export function estimateLaserLinewidth(input: LaserEstimateInput): LaserEstimate {
  if (input === null || typeof input !== 'object') throw new AnalysisInputError('the laser description must be an object');
  const lambdaNm = positive(input.wavelengthNm, 'wavelengthNm');
  const ng = positive(input.groupIndex, 'groupIndex');
  if (ng < 1) throw new AnalysisInputError(`groupIndex must be >= 1, got ${ng}`);
  const lengthCm = positive(input.cavityLengthUm, 'cavityLengthUm') * 1e-4;
  const alphaI = input.internalLossPerCm;
  if (!(typeof alphaI === 'number' && Number.isFinite(alphaI) && alphaI >= 0)) {
    throw new AnalysisInputError(`internalLossPerCm must be a finite number >= 0, got ${String(alphaI)}`);
  }
  const nsp = positive(input.nsp, 'nsp');
  if (nsp < 1) throw new AnalysisInputError(`nsp must be >= 1 (full inversion), got ${nsp}`);
  const alpha = input.alphaFactor;
  if (!(typeof alpha === 'number' && Number.isFinite(alpha))) throw new AnalysisInputError(`alphaFactor must be a finite number, got ${String(alpha)}`);
  const p1Mw = positive(input.outputPowerMw, 'outputPowerMw');
  const assumptions: string[] = [];

  let alphaM: number;
  let share: number;
  if (input.facetReflectivities !== undefined) {
    if (input.mirrorLossPerCm !== undefined) throw new AnalysisInputError('give facetReflectivities or mirrorLossPerCm, not both');
    const r = input.facetReflectivities;
    if (!Array.isArray(r) || r.length !== 2 || !r.every((v) => typeof v === 'number' && v > 0 && v <= 1)) {
      throw new AnalysisInputError(`facetReflectivities must be [R1, R2], power reflectivities in (0, 1], got ${JSON.stringify(r)}`);
    }
    const [r1, r2] = r;
    if (r1 === 1) throw new AnalysisInputError('facet 1 is the output facet whose power is given: R1 must be < 1');
    alphaM = Math.log(1 / (r1 * r2)) / (2 * lengthCm); // α_m = ln(1/(R1R2))/(2L)
    // share of the output through facet 1 (unequal facets)
    const a = (1 - r1) * Math.sqrt(r2);
    const b = (1 - r2) * Math.sqrt(r1);
    share = a / (a + b);
  } else if (input.mirrorLossPerCm !== undefined) {
    alphaM = positive(input.mirrorLossPerCm, 'mirrorLossPerCm');
    share = 0.5;
    assumptions.push('mirror loss given without reflectivities: the two facets are taken as equal, each carrying half the output');
  } else {
    throw new AnalysisInputError('give facetReflectivities [R1, R2] or mirrorLossPerCm');
  }

  const nu = SPEED_OF_LIGHT_M_PER_S / (lambdaNm * 1e-9); // ν = c/λ
  const hv = PLANCK_CONSTANT_J_S * nu;
  const vgM = SPEED_OF_LIGHT_M_PER_S / ng; // v_g = c/n_g
  const gth = alphaI + alphaM; // 1/cm
  const decayRate = vgM * gth * 100; // v_g g_th, 1/s (1/cm → 1/m)
  const coldCavity = decayRate / (2 * Math.PI); // Δν_c = v_g g_th/(2π)
  const eta0 = alphaM / gth;
  const pOutW = (p1Mw * 1e-3) / share;
  // Δν_ST = π hν Δν_c² n_sp η₀ / P_out
  const st = cavityFormLinewidthHz({ opticalFrequencyHz: nu, coldCavityLinewidthHz: coldCavity, nsp, alphaFactor: 0, opticalEfficiency: eta0, totalOutputPowerW: pOutW });
  const photons = pOutW / (hv * vgM * alphaM * 100); // N_ph = P_out/(hν v_g α_m)
  assumptions.push('single longitudinal mode, above threshold; Petermann factor 1; n_sp and α taken as given');
  return {
    coldCavityLinewidthHz: coldCavity,
    schawlowTownesLinewidthHz: st,
    enhancedLinewidthHz: st * (1 + alpha * alpha), // Henry: × (1 + α²)
    opticalFrequencyHz: nu,
    photonEnergyJ: hv,
    groupVelocityMPerS: vgM,
    mirrorLossPerCm: alphaM,
    thresholdGainPerCm: gth,
    opticalEfficiency: eta0,
    photonLifetimeS: 1 / decayRate,
    outputFacetShare: share,
    totalOutputPowerMw: pOutW * 1e3,
    photonNumber: photons,
    assumptions,
  };
}
