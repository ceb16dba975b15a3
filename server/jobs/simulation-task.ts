/**
 * What a simulation worker receives and returns (plain data, by structured clone).
 */
import type { RateEquationParameters } from '../../analysis/laser/rate-equation-model';

export interface SimulationTask {
  parameters: Partial<RateEquationParameters>;
  sampleRateHz: number;
  samples: number;
  seed: number;
  maxStepS?: number;
}

export type SimulationOutcome =
  /** the .npy file (its buffer moved) */
  | Uint8Array
  /** an AnalysisInputError's message (bad parameters), verbatim */
  | { message: string };
