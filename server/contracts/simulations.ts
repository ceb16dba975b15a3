/**
 * Rate-equation simulation contracts: a single-mode semiconductor laser simulated with Langevin noise in a
 * worker thread, written onto the bench as a synthetic IQ capture (.npy float32 (N, 2), tagged "synthetic")
 * through the ordinary capture storage and analysis queue.
 *   POST /api/benches/:benchId/simulations   CreateSimulationRequest -> 202 SimulationResponse (owner, analyst)
 *   GET  /api/benches/:benchId/simulations   -> SimulationListResponse (any member)
 *   GET  /api/simulations/:id                -> SimulationResponse (any member of its bench)
 * Members of other benches get 404 not_found for every simulation id.
 * Model and defaults: analysis/laser/rate-equation-model.ts and rate-equations.ts (Phaseloom METHODS 6.4;
 * parameter values after Coldren, Corzine & Mašanović, 2nd ed. (2012) — from memory, not verified).
 */
import { z } from 'zod';
import { DisplayName, Id, Timestamp } from './common';

const positive = z.number('must be a number').finite('must be finite').positive('must be positive');
const finite = z.number('must be a number').finite('must be finite');
const fraction = z.number('must be a number').gt(0, 'must lie in (0, 1]').max(1, 'must lie in (0, 1]');

/** Any subset of the model's parameters; the rest take the textbook-order defaults. */
export const RateEquationParametersInput = z.strictObject({
  currentMa: positive.max(1000, 'must be at most 1000 mA').optional(),
  wavelengthNm: positive.optional(),
  cavityLengthUm: positive.optional(),
  activeVolumeCm3: positive.optional(),
  confinementFactor: fraction.optional(),
  groupIndex: z.number('must be a number').finite('must be finite').min(1, 'must be at least 1').optional(),
  internalLossPerCm: positive.optional(),
  facetReflectivities: z
    .tuple(
      [z.number('must be a number').gt(0, 'must lie in (0, 1)').lt(1, 'must lie in (0, 1)'), z.number('must be a number').gt(0, 'must lie in (0, 1)').lt(1, 'must lie in (0, 1)')],
      { error: 'must be [R1, R2] in (0, 1)' },
    )
    .optional(),
  gainCoefficientPerCm: positive.optional(),
  transparencyDensityCm3: positive.optional(),
  gainShiftDensityCm3: finite.optional(),
  defectRecombinationPerS: positive.optional(),
  radiativeRecombinationCm3PerS: positive.optional(),
  augerRecombinationCm6PerS: positive.optional(),
  spontaneousCoupling: fraction.optional(),
  gainCompressionCm3: positive.optional(),
  injectionEfficiency: fraction.optional(),
  alphaFactor: finite.optional(),
});
export type RateEquationParametersInput = z.infer<typeof RateEquationParametersInput>;

/** Samples in one simulated record (N = duration × sample rate, rounded). */
export const MIN_SIMULATION_SAMPLES = 4096;
export const MAX_SIMULATION_SAMPLES = 1 << 21;

export const CreateSimulationRequest = z
  .strictObject({
    name: DisplayName.optional(),
    /** the laser the synthetic capture is filed under (optional) */
    laserId: Id.optional(),
    parameters: RateEquationParametersInput.default({}),
    /** recorded time, s */
    durationS: positive.max(1e-3, 'must be at most 1 ms'),
    /** IQ sample rate, Hz */
    sampleRateHz: positive.min(1e8, 'must be at least 100 MHz').max(1e11, 'must be at most 100 GHz'),
    seed: z.number('must be a whole number').int('must be a whole number').min(0, 'must be 0 or more').max(2 ** 32, 'must be at most 2^32').default(1),
    /** largest integration step, s (default 1 ps; the photon lifetime is a few ps) */
    maxStepS: z.number('must be a number').min(1e-14, 'must be at least 1e-14 s').max(1e-11, 'must be at most 1e-11 s').optional(),
  })
  .superRefine((v, ctx) => {
    const n = Math.round(v.durationS * v.sampleRateHz);
    if (n < MIN_SIMULATION_SAMPLES || n > MAX_SIMULATION_SAMPLES) {
      ctx.addIssue({
        code: 'custom',
        path: ['durationS'],
        message: `duration × sample rate must give ${MIN_SIMULATION_SAMPLES} to ${MAX_SIMULATION_SAMPLES} samples, got ${n}`,
      });
    }
  });
export type CreateSimulationRequest = z.input<typeof CreateSimulationRequest>;
export type ParsedCreateSimulationRequest = z.output<typeof CreateSimulationRequest>;

export const SimulationStatus = z.enum(['queued', 'running', 'done', 'failed']);
export type SimulationStatus = z.infer<typeof SimulationStatus>;

/** What the model predicts at its deterministic steady state, and the estimator for the same laser. */
export const SimulationPrediction = z.object({
  thresholdCurrentMa: z.number(),
  outputPowerMw: z.number(),
  photons: z.number(),
  carrierDensityCm3: z.number(),
  spontaneousRatePerS: z.number(),
  photonLifetimeS: z.number(),
  relaxationFrequencyHz: z.number(),
  /** R_sp(1 + α²)/(4πP), Hz */
  predictedLinewidthHz: z.number(),
  /** n_sp of the same laser: R_sp/(v_g g_th) = R_sp·τ_p (the estimator's spontaneous-emission factor) */
  equivalentNsp: z.number(),
  /** the estimator's inputs for the same laser (POST /api/laser-estimates takes them as they are) */
  estimatorInput: z.object({
    wavelengthNm: z.number(),
    groupIndex: z.number(),
    cavityLengthUm: z.number(),
    facetReflectivities: z.tuple([z.number(), z.number()]),
    internalLossPerCm: z.number(),
    nsp: z.number(),
    alphaFactor: z.number(),
    outputPowerMw: z.number(),
  }),
});
export type SimulationPrediction = z.infer<typeof SimulationPrediction>;

export const Simulation = z.object({
  id: Id,
  benchId: Id,
  laserId: Id.nullable(),
  name: z.string(),
  status: SimulationStatus,
  /** 0..1 of the simulated samples */
  progress: z.number(),
  stage: z.string(),
  parameters: RateEquationParametersInput,
  durationS: z.number(),
  sampleRateHz: z.number(),
  seed: z.number(),
  maxStepS: z.number().nullable(),
  samples: z.number().int(),
  prediction: SimulationPrediction.nullable(),
  /** the synthetic capture and its first analysis, once stored */
  captureId: Id.nullable(),
  analysisId: Id.nullable(),
  /** the ordinary analysis of the synthetic capture, as it goes (null before the capture is stored) */
  analysis: z
    .object({
      status: z.enum(['queued', 'running', 'done', 'failed']),
      progress: z.number(),
      intrinsicLinewidthHz: z.number().nullable(),
    })
    .nullable(),
  error: z.string().nullable(),
  createdBy: Id.nullable(),
  createdAt: Timestamp,
  finishedAt: Timestamp.nullable(),
});
export type Simulation = z.infer<typeof Simulation>;

export const SimulationResponse = z.object({ simulation: Simulation });
export type SimulationResponse = z.infer<typeof SimulationResponse>;

export const SimulationListResponse = z.object({ simulations: z.array(Simulation) });
export type SimulationListResponse = z.infer<typeof SimulationListResponse>;
