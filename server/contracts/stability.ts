/**
 * Frequency-stability contracts: the overlapping Allan deviation of an analysis's capture at
 * octave-spaced τ, with χ² confidence intervals and the noise type read from the local slope
 * (IEEE Std 1139-2008; W. J. Riley, NIST SP 1065 (2008); Phaseloom METHODS 5).
 *   GET /api/analyses/:id/allan -> AllanResponse (any member of the bench; 409 while the analysis is not done)
 * basis 'fractional': σ_y(τ) of y = (ν − ν0)/ν0 with ν0 from the capture's laser (nu0Hz);
 * basis 'hz': no optical frequency is known, so the deviation is of the frequency itself, in Hz.
 */
import { z } from 'zod';

export const AllanSlopeClass = z.enum(['pm', 'white-fm', 'flicker-fm', 'random-walk-fm']);
export type AllanSlopeClass = z.infer<typeof AllanSlopeClass>;

export const AllanPoint = z.object({
  tauS: z.number(),
  deviation: z.number(),
  /** bounds of the deviation at `confidence` */
  lower: z.number(),
  upper: z.number(),
  /** equivalent degrees of freedom behind the interval */
  edf: z.number(),
  slopeClass: AllanSlopeClass.nullable(),
});
export type AllanPoint = z.infer<typeof AllanPoint>;

export const AllanRegion = z.object({
  slopeClass: AllanSlopeClass,
  /** the power law's slope of σ against τ: −1, −½, 0, +½ */
  referenceSlope: z.number(),
  fittedSlope: z.number().nullable(),
  tauRangeS: z.tuple([z.number(), z.number()]),
});

export const AllanResponse = z.object({
  analysisId: z.string(),
  basis: z.enum(['fractional', 'hz']),
  nu0Hz: z.number().optional(),
  estimator: z.literal('overlapping'),
  confidence: z.number(),
  points: z.array(AllanPoint),
  regions: z.array(AllanRegion),
  /** τ0 of the record the estimate used, s, and how many frequency samples were averaged into one */
  sampleIntervalS: z.number(),
  decimation: z.number().int(),
  phasePoints: z.number().int(),
  warnings: z.array(z.string()),
});
export type AllanResponse = z.infer<typeof AllanResponse>;
