/**
 * What the job runner hands a worker thread and what it gets back. Everything here crosses a thread
 * boundary by structured clone, so it is plain data (the storage travels as its config).
 */
import type { StorageConfig } from '../storage/storage';

/** How to read the stored capture: the capture row's columns, as the engine's options want them. */
export interface CaptureInput {
  kind: 'phase' | 'iq' | 'beat' | 'frequency';
  format: 'csv' | 'npy' | 'wav' | 'raw';
  sampleRateHz: number | null;
  dtype: 'int16' | 'int32' | 'float32' | 'float64' | null;
  channels: 1 | 2 | null;
  byteOrder: 'little' | 'big' | null;
  sizeBytes: number;
  /** the name the file was uploaded with (reported in result.input.fileName) */
  fileName: string;
}

/** The analysis settings of one analyses row (the same names as the CLI's options, camelCase). */
export interface JobSettings {
  window?: 'hann' | 'blackman-harris' | 'flat-top';
  segment?: number;
  overlap?: number;
  observationTimeS?: number;
  floorBandHz?: [number, number];
}

export interface AnalysisTask {
  analysisId: string;
  storage: StorageConfig;
  captureKey: string;
  /** where the worker writes the full series (made by the runner, unique per attempt) */
  seriesKey: string;
  input: CaptureInput;
  settings: JobSettings;
  /** points of the log-binned display series kept in the row */
  displayPoints: number;
}

/** The headline figures, copied into columns so lists and sweeps need not open `result`. */
export interface AnalysisFigures {
  intrinsicLinewidthHz: number | null;
  betaLinewidthHz: number | null;
  lineshapeFwhmHz: number | null;
  whiteFloorHz2PerHz: number | null;
}

export interface DisplaySeries {
  frequencyHz: number[];
  frequencyNoiseHz2PerHz: number[];
}

export type AnalysisOutcome =
  | {
      ok: true;
      /** the CLI's JSON object without `spectrum` */
      result: Record<string, unknown>;
      figures: AnalysisFigures;
      displaySeries: DisplaySeries;
      /** the key the full series was written under, or null when the engine gave no series */
      seriesKey: string | null;
    }
  | {
      ok: false;
      /** an AnalysisInputError's message, verbatim: the input cannot be analysed as asked */
      message: string;
    };

export interface ProgressUpdate {
  fraction: number;
  stage: string;
}

/** Runs analysis tasks somewhere else than the event loop (a worker-thread pool). */
export interface AnalysisExecutor {
  /** how many tasks may run at once */
  readonly size: number;
  run(task: AnalysisTask, onProgress: (update: ProgressUpdate) => void, signal?: AbortSignal): Promise<AnalysisOutcome>;
  close(): Promise<void>;
}
