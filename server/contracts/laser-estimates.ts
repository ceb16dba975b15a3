/**
 * Laser-estimator contracts: the linewidth a Fabry–Perot laser's design predicts.
 *   POST /api/laser-estimates  LaserEstimateRequest -> LaserEstimateResponse (any signed-in user; nothing is stored)
 * Formulas: analysis/laser/estimator.ts (Phaseloom METHODS 6.1; C. H. Henry, IEEE J. Quantum Electron.
 * QE-18(2), 259-264 (1982) — details from memory). `outputPowerMw` is the power out of facet 1 (R1);
 * with mirrorLossPerCm instead of reflectivities the facets are taken as equal (each carries half).
 */
import { z } from 'zod';

const positive = z.number('must be a number').finite('must be finite').positive('must be positive');
const reflectivity = z.number('must be a number').gt(0, 'must lie in (0, 1)').lt(1, 'must lie in (0, 1)');

export const LaserEstimateRequest = z
  .strictObject({
    wavelengthNm: positive,
    groupIndex: z.number('must be a number').finite('must be finite').min(1, 'must be at least 1'),
    cavityLengthUm: positive,
    /** power reflectivities [R1, R2] of the facets, each in (0, 1); R1 is the output facet */
    facetReflectivities: z.tuple([reflectivity, reflectivity], { error: 'must be [R1, R2], power reflectivities in (0, 1)' }).optional(),
    /** or the mirror loss α_m, 1/cm */
    mirrorLossPerCm: positive.optional(),
    internalLossPerCm: z.number('must be a number').finite('must be finite').min(0, 'must be 0 or more'),
    nsp: z.number('must be a number').finite('must be finite').min(1, 'must be at least 1 (full inversion)'),
    alphaFactor: z.number('must be a number').finite('must be finite'),
    /** power out of facet 1, mW */
    outputPowerMw: positive,
  })
  .superRefine((v, ctx) => {
    const given = Number(v.facetReflectivities !== undefined) + Number(v.mirrorLossPerCm !== undefined);
    if (given !== 1) ctx.addIssue({ code: 'custom', path: ['facetReflectivities'], message: 'give facetReflectivities [R1, R2] or mirrorLossPerCm (one of them)' });
  });
export type LaserEstimateRequest = z.infer<typeof LaserEstimateRequest>;

export const LaserEstimateResponse = z.object({
  coldCavityLinewidthHz: z.number(),
  schawlowTownesLinewidthHz: z.number(),
  enhancedLinewidthHz: z.number(),
  opticalFrequencyHz: z.number(),
  photonEnergyJ: z.number(),
  groupVelocityMPerS: z.number(),
  mirrorLossPerCm: z.number(),
  thresholdGainPerCm: z.number(),
  opticalEfficiency: z.number(),
  photonLifetimeS: z.number(),
  outputFacetShare: z.number(),
  totalOutputPowerMw: z.number(),
  photonNumber: z.number(),
  /** Δν·P, Hz·W: the 1/P law through this point (for plotting beside a measured sweep) */
  linewidthPowerProductHzW: z.number(),
  assumptions: z.array(z.string()),
  /** what is from memory (METHODS 6.1), to show beside the figures */
  fromMemory: z.array(z.string()),
});
export type LaserEstimateResponse = z.infer<typeof LaserEstimateResponse>;
