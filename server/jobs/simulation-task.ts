/**
 * What a simulation worker thread receives and sends back (plain data, by structured clone).
 */
import type { RateEquationParameters } from '../../analysis/laser/rate-equation-model';

export interface SimulationTask {
  parameters: Partial<RateEquationParameters>;
  sampleRateHz: number;
  samples: number;
  seed: number;
  maxStepS?: number;
}

export type SimulationMessage =
  | { type: 'progress'; fraction: number }
  /** the .npy file, its buffer transferred */
  | { type: 'done'; npy: Uint8Array }
  /** an AnalysisInputError's message (bad parameters), verbatim */
  | { type: 'failed'; message: string };
