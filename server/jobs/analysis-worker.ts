/**
 * The worker thread of the analysis pool (piscina): streams a stored capture through the engine's
 * analyzeCapture, writes the full spectra to storage, and returns the report (the CLI's JSON without
 * its series), the headline figures and a log-binned display series. Progress goes back on the task's
 * port at most every 100 ms (the runner writes it to the database at most every 500 ms).
 * An AnalysisInputError is an answer, not a crash: it comes back as { ok: false, message } with the
 * engine's message verbatim. Anything else is thrown and fails the job as a crash.
 */
import { isAnalysisInputError } from '../../analysis/errors';
import { analyzeCapture, type AnalyzeOptions } from '../../analysis/pipeline';
import { logBinSpectrum } from '../../analysis/spectrum/log-binning';
import { createStorage } from '../storage/create-storage';
import type { Storage, StorageConfig } from '../storage/storage';
import type { AnalysisOutcome, AnalysisTask } from './analysis-task';
import { encodeSeries } from './series-file';
import type { WorkerMessage } from './worker-pool';

const stores = new Map<string, Storage>();
function storageFor(config: StorageConfig): Storage {
  const key = JSON.stringify(config);
  let s = stores.get(key);
  if (!s) stores.set(key, (s = createStorage(config)));
  return s;
}

const PROGRESS_EVERY_MS = 100;
const CHUNK_BYTES = 4 << 20;

/** The engine's options for a stored capture: the capture's columns and the analysis settings. */
export function engineOptions(task: AnalysisTask): AnalyzeOptions {
  const { input, settings } = task;
  const options: AnalyzeOptions = {
    kind: input.kind,
    format: input.format,
    fileName: input.fileName,
    window: settings.window,
    segment: settings.segment,
    overlap: settings.overlap,
    observationTimeS: settings.observationTimeS,
    floorBandHz: settings.floorBandHz,
    series: false,
  };
  if (input.sampleRateHz !== null) options.sampleRateHz = input.sampleRateHz;
  if (input.format === 'raw') {
    if (input.dtype) options.dtype = input.dtype;
    if (input.channels) options.channels = input.channels;
    if (input.byteOrder) options.byteOrder = input.byteOrder;
  }
  return options;
}

const finiteOrNull = (v: number | null | undefined): number | null => (typeof v === 'number' && Number.isFinite(v) ? v : null);

export default async function runAnalysis({ task, port }: WorkerMessage): Promise<AnalysisOutcome> {
  const storage = storageFor(task.storage);
  let lastPost = 0;
  let lastStage = '';
  const onProgress = (fraction: number, stage: string) => {
    const now = Date.now();
    if (stage === lastStage && now - lastPost < PROGRESS_EVERY_MS && fraction < 1) return;
    lastPost = now;
    lastStage = stage;
    port.postMessage({ fraction, stage });
  };
  try {
    // 4 MiB chunks, as the CLI reads: the same blocks give bit-identical figures for the same file
    const stream = await storage.open(task.captureKey, { highWaterMark: CHUNK_BYTES });
    let analysis;
    try {
      analysis = await analyzeCapture({ chunks: stream, totalBytes: task.input.sizeBytes }, engineOptions(task), onProgress);
    } finally {
      stream.destroy();
    }
    onProgress(1, 'saving');
    // the stitched spectrum: every Welch bin from about 1/T0 to the top of the trusted band (the CLI's `spectrum`)
    const { frequencyHz, psd } = analysis.trustedSpectrum;
    await storage.put(task.seriesKey, [encodeSeries(frequencyHz, psd)]);
    const display = logBinSpectrum({ frequencyHz, psd }, { points: task.displayPoints });
    const { spectrum: _spectrum, logSpectrum: _logSpectrum, ...result } = analysis.report;
    const r = analysis.report;
    return {
      ok: true,
      result: result as unknown as Record<string, unknown>,
      figures: {
        intrinsicLinewidthHz: finiteOrNull(r.intrinsicLinewidthHz),
        betaLinewidthHz: finiteOrNull(r.betaLine.linewidthHz),
        lineshapeFwhmHz: finiteOrNull(r.lineshape.fwhmHz),
        whiteFloorHz2PerHz: finiteOrNull(r.whiteFloor.valueHz2PerHz),
      },
      displaySeries: {
        frequencyHz: Array.from(display.frequencyHz),
        frequencyNoiseHz2PerHz: Array.from(display.psd),
      },
      seriesKey: task.seriesKey,
    };
  } catch (e) {
    if (isAnalysisInputError(e)) return { ok: false, message: e.message };
    throw e;
  }
}
