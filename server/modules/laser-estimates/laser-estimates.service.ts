/**
 * Laser estimates: the cold-cavity, Schawlow–Townes and α-enhanced (Henry) linewidths a Fabry–Perot
 * laser's design predicts (analysis/laser/estimator.ts, Phaseloom METHODS 6.1). Nothing is stored, so the
 * module has no repository.
 */
import { estimateLaserLinewidth } from '../../../analysis/laser/estimator';
import type { LaserEstimateRequest, LaserEstimateResponse } from '../../contracts/laser-estimates';

/** METHODS 6.1 and 10 mark these as from memory; the page shows them beside the figures. */
export const ESTIMATOR_FROM_MEMORY: readonly string[] = [
  'Henry’s formula and its (1 + α²) enhancement: C. H. Henry, IEEE J. Quantum Electron. QE-18(2), 259-264 (1982) — details from memory (METHODS 6.1)',
  'the share of the output through facet 1 for unequal facets, after Coldren, Corzine & Mašanović, 2nd ed. (2012) — from memory',
  'typical n_sp 1.5-2.5 and α 2-7 (bulk 4-7, MQW 2-5) — order of magnitude only, from memory (METHODS 6.2)',
];

export function estimateLaser(input: LaserEstimateRequest): LaserEstimateResponse {
  const e = estimateLaserLinewidth({
    wavelengthNm: input.wavelengthNm,
    groupIndex: input.groupIndex,
    cavityLengthUm: input.cavityLengthUm,
    ...(input.facetReflectivities ? { facetReflectivities: input.facetReflectivities } : { mirrorLossPerCm: input.mirrorLossPerCm }),
    internalLossPerCm: input.internalLossPerCm,
    nsp: input.nsp,
    alphaFactor: input.alphaFactor,
    outputPowerMw: input.outputPowerMw,
  });
  return {
    ...e,
    // Δν ∝ 1/P above threshold (METHODS 6.3): Δν·P_facet is the constant of the predicted 1/P line
    linewidthPowerProductHzW: e.enhancedLinewidthHz * input.outputPowerMw * 1e-3,
    fromMemory: [...ESTIMATOR_FROM_MEMORY],
  };
}
