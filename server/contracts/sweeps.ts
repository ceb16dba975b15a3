/**
 * Sweep contracts. A sweep is a laser's linewidths (intrinsic and β-line, from the latest done
 * analysis of each capture) against one operating parameter of its captures.
 *   GET /api/benches/:benchId/lasers/:laserId/sweep?parameter=driveCurrentMa|outputPowerMw|temperatureC
 *       -> SweepResponse (any member)
 * For output power each linewidth gets the straight-line fit Δν = a/P + Δν₀ in x = 1/P (Phaseloom
 * METHODS 6.3; analysis/laser/power-sweep.ts) once it has at least 3 points; otherwise `fit` is null
 * and `reason` says why. Other parameters are not fitted (reason given).
 */
import { z } from 'zod';
import { Id, Timestamp } from './common';

export const SweepParameter = z.enum(['driveCurrentMa', 'outputPowerMw', 'temperatureC']);
export type SweepParameter = z.infer<typeof SweepParameter>;

export const SWEEP_PARAMETERS: Record<SweepParameter, { label: string; unit: string }> = {
  driveCurrentMa: { label: 'Drive current', unit: 'mA' },
  outputPowerMw: { label: 'Output power', unit: 'mW' },
  temperatureC: { label: 'Temperature', unit: '°C' },
};

export const SweepQuery = z.object({ parameter: SweepParameter });
export type SweepQuery = z.input<typeof SweepQuery>;

export const SweepPoint = z.object({
  captureId: Id,
  analysisId: Id,
  fileName: z.string(),
  createdAt: Timestamp,
  /** the operating parameter, in SWEEP_PARAMETERS[parameter].unit */
  x: z.number(),
  intrinsicLinewidthHz: z.number().nullable(),
  betaLinewidthHz: z.number().nullable(),
});
export type SweepPoint = z.infer<typeof SweepPoint>;

/** Δν = a/P + Δν₀ by least squares in 1/P. */
export const SweepFit = z.object({
  /** a, Hz·W */
  slopeHzW: z.number(),
  slopeUncertaintyHzW: z.number(),
  /** Δν₀, the power-independent floor, Hz */
  floorHz: z.number(),
  floorUncertaintyHz: z.number(),
  r2: z.number(),
  points: z.number().int(),
  warnings: z.array(z.string()),
});
export type SweepFit = z.infer<typeof SweepFit>;

export const SweepFitOutcome = z.object({ fit: SweepFit.nullable(), reason: z.string().nullable() });
export type SweepFitOutcome = z.infer<typeof SweepFitOutcome>;

export const SweepResponse = z.object({
  laser: z.object({ id: Id, name: z.string() }),
  parameter: SweepParameter,
  unit: z.string(),
  /** ascending in x */
  points: z.array(SweepPoint),
  /** analysed captures left out because they do not state this parameter */
  withoutParameter: z.number().int(),
  fits: z.object({ intrinsic: SweepFitOutcome, beta: SweepFitOutcome }),
});
export type SweepResponse = z.infer<typeof SweepResponse>;
