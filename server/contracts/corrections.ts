/**
 * Measurement-correction contracts (Phaseloom METHODS 4.1, 4.3). A correction is made from an analysis's
 * full S_ν series and kept beside it; the figures (white floor, intrinsic linewidth π·S_ν,white, β-line
 * linewidth) are read again from the corrected spectrum.
 *   POST   /api/analyses/:id/corrections  CreateCorrectionRequest -> 201 CorrectionResponse (owner, analyst)
 *   GET    /api/analyses/:id/corrections  -> CorrectionListResponse (any member)
 *   GET    /api/corrections/:id           -> CorrectionResponse (any member)
 *   DELETE /api/corrections/:id           -> 204 (owner, analyst)
 * 'reference': heterodyne against a reference laser of known noise — its analysis on the same bench
 *   (referenceAnalysisId) or its Lorentzian linewidth (linewidthHz, white level Δν/π) — subtracted bin by bin;
 *   bins that go to or below zero are flagged and left out.
 * 'delay-interferometer': the analysed phase was Δφ(t) = φ(t) − φ(t − τ) from an unbalanced interferometer;
 *   S_ν = f²S_Δφ/(4 sin²(πfτ)) with the bins near the zeros n/τ masked (4 sin² < maskThreshold, default 0.1).
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';

export const CreateCorrectionRequest = z.discriminatedUnion('type', [
  z
    .object({
      type: z.literal('reference'),
      referenceAnalysisId: Id.optional(),
      linewidthHz: z.number().min(0, 'must be 0 or more').max(1e12, 'must be at most 1e12').optional(),
    })
    .strict()
    .refine((v) => (v.referenceAnalysisId === undefined) !== (v.linewidthHz === undefined), {
      message: 'give the reference as referenceAnalysisId or as linewidthHz (one of them)',
      path: ['referenceAnalysisId'],
    }),
  z
    .object({
      type: z.literal('delay-interferometer'),
      delayS: z.number().positive('must be positive').max(1, 'must be at most 1 s'),
      maskThreshold: z.number().gt(0, 'must be above 0').lt(4, 'must be below 4').optional(),
    })
    .strict(),
]);
export type CreateCorrectionRequest = z.input<typeof CreateCorrectionRequest>;

export const CorrectionFigures = z.object({
  whiteFloorHz2PerHz: z.number().nullable(),
  /** π·S_ν,white */
  intrinsicLinewidthHz: z.number().nullable(),
  betaLinewidthHz: z.number().nullable(),
});
export type CorrectionFigures = z.infer<typeof CorrectionFigures>;

export const Correction = z.object({
  id: Id,
  analysisId: Id,
  type: z.enum(['reference', 'delay-interferometer']),
  params: z.record(z.string(), z.union([z.string(), z.number()])),
  /** the analysis's own figures, and the ones read from the corrected spectrum */
  before: CorrectionFigures,
  figures: CorrectionFigures,
  /** reference: 'spectrum' or 'white-level'; bins flagged (≤ 0 after subtraction, outside the reference's band) */
  method: z.string().nullable(),
  notPositiveCount: z.number().int(),
  outsideReferenceCount: z.number().int(),
  /** delay interferometer: the masked bins as [first, last] Hz ranges, their count, the first zero 1/τ */
  maskedCount: z.number().int(),
  maskedRangesHz: z.array(z.tuple([z.number(), z.number()])),
  firstZeroHz: z.number().nullable(),
  warnings: z.array(z.string()),
  /** the corrected S_ν, log-binned for display (kept bins only) */
  display: z.object({ frequencyHz: z.array(z.number()), frequencyNoiseHz2PerHz: z.array(z.number()) }),
  createdBy: Id.nullable(),
  createdAt: Timestamp,
});
export type Correction = z.infer<typeof Correction>;

export const CorrectionResponse = z.object({ correction: Correction });
export type CorrectionResponse = z.infer<typeof CorrectionResponse>;

export const CorrectionListResponse = z.object({ corrections: z.array(Correction) });
export type CorrectionListResponse = z.infer<typeof CorrectionListResponse>;
