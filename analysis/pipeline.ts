/**
 * analyzeCapture — the streaming path of one capture: bytes → samples → frequency → spectra → figures.
 *
 *   reader (io/: CSV | NPY | WAV | raw, format sniffed unless given)
 *     → frequency stage (phase/frequency-stage.ts: unwrap | analytic signal → ν in Hz)
 *     → log-frequency accumulator (spectrum/log-frequency.ts): a cascade of decimate-by-2 stages, each
 *       a Welch accumulator with the stated window and overlap; its stage 0 is the plain Welch
 *       estimate at full rate with the stated segment L, the deeper stages (segments as the cascade
 *       chooses) reach down to about 1/T0. One pass serves both:
 *       the stitched spectrum (every Welch bin, from the finest stage serving it) and, binned to 30
 *       points per decade, the log view the figures are read from.
 *     → figures: noise model on the log view, each point weighted by its averages
 *       (noise/model-fit.ts); spurs (narrow lines, with their power) and bumps (broad features, with
 *       centre and width) on the stitched spectrum (noise/spurs.ts); white floor and intrinsic
 *       linewidth π·S_ν,white, the fitted flicker/random-walk part subtracted (linewidth/white-floor.ts);
 *       β-separation-line linewidth (linewidth/beta-line.ts) and lineshape FWHM (linewidth/lineshape.ts)
 *       over the log view read linearly (bin averages keep ∫S df), each spur taken out of the stitched
 *       spectrum and put back once as a line of its measured power.
 * The same code serves the CLI (node fs stream), the worker thread and the tests. Memory is bounded:
 * no stage holds the record; each chunk becomes one block of samples and is dropped after use.
 * Options are checked once at entry (one AnalysisInputError per broken rule); what depends on the
 * file (format, sample rate, kind, default segment) is resolved once, when the header has been read.
 * Units: Hz, s; every S_ν one-sided Hz²/Hz.
 * Defaults: window 'hann'; overlap 0.5; segment the largest power of two ≤ N/8 within [256, 65536]
 * (4096 when the record length cannot be estimated); per-segment linear detrend (removes the carrier
 * offset and a drift, METHODS 1.4 and 2.3); observation time T0 = the record length (the lowest log
 * point, within 2/T0, is stretched flat down to 1/T0: linewidth/spectrum-grid.ts); white-floor band found
 * automatically from the bottom of the reliable band (K ≥ 2, bin ≥ 4) up to fs/10 of the frequency series
 * (METHODS 2.4) or a beat note's trusted top B/2 (METHODS 2.2), whichever is lower, bumps left out;
 * spectra in the report only with `series`.
 * Report: `warnings` say what may make a figure wrong; `notes` say which documented approximation or
 * exclusion applied (a line left out of the fit, the flicker part subtracted from the floor, …).
 * Kind: given, or two channels → 'iq', or a CSV column name (phase, frequency, beat); otherwise the
 * kind must be given. Sample rate: given (wins, with a warning when the file states another), or
 * the file's (WAV header, CSV time column).
 * Check: white frequency noise h0 = 1e4 Hz²/Hz gives whiteFloor ≈ 1e4 and intrinsicLinewidthHz ≈
 * π·1e4 = 31415.9 Hz (tests/analysis/pipeline.test.ts).
 */
import { AnalysisInputError } from './errors';
import { createReader } from './io/create-reader';
import { inferKind } from './io/preview';
import { type FormatSource, SNIFF_BYTES, chooseFormat } from './io/sniff';
import { type BetaLineReport, betaLine } from './linewidth/beta-line';
import { type LineshapeReport, lineshape } from './linewidth/lineshape';
import { type WhiteFloorReport, whiteFloor } from './linewidth/white-floor';
import { type NoiseModelFitResult, fitNoiseModel } from './noise/model-fit';
import { type SpectralBump, type SpurLine, addLineBlocks, findSpectralFeatures, removeLines } from './noise/spurs';
import { createFrequencyStage } from './phase/frequency-stage';
import { equivalentAverages } from './spectrum/equivalent-averages';
import { logBinSpectrum } from './spectrum/log-binning';
import { createLogFrequencyAccumulator } from './spectrum/log-frequency';
import { WINDOW_NAMES, makeWindow, windowSums } from './spectrum/windows';
import type {
  ByteOrder,
  CaptureFormat,
  CaptureKind,
  DetrendName,
  FrequencyStageSummary,
  LogFrequencySpectrum,
  Spectrum,
  ProgressFn,
  RawDtype,
  ReaderInfo,
  SampleBlock,
  Spur,
  StreamingReader,
  WindowName,
} from './types';

export interface AnalyzeOptions {
  kind?: CaptureKind;
  format?: CaptureFormat;
  fileName?: string;
  sampleRateHz?: number;
  /** raw files: element type; channels (2 = interleaved I,Q; default 2 for kind 'iq', else 1); byte order (default little) */
  dtype?: RawDtype;
  channels?: 1 | 2;
  byteOrder?: ByteOrder;
  window?: WindowName;
  /** Welch segment length L, samples */
  segment?: number;
  /** overlap fraction in [0, 1) */
  overlap?: number;
  /** T0, s (default the record length) */
  observationTimeS?: number;
  /** band [lo, hi] Hz for the white floor (default: found automatically) */
  floorBandHz?: [number, number];
  /** put the spectra in the report */
  series?: boolean;
}

export interface CaptureSource {
  chunks: AsyncIterable<Uint8Array> | Iterable<Uint8Array>;
  /** file size, for progress and for early checks of header claims */
  totalBytes?: number;
}

export interface ResolvedAnalyzeOptions {
  kind: CaptureKind | undefined;
  format: CaptureFormat | undefined;
  fileName: string | undefined;
  sampleRateHz: number | undefined;
  dtype: RawDtype | undefined;
  channels: 1 | 2 | undefined;
  byteOrder: ByteOrder | undefined;
  window: WindowName;
  segment: number | undefined;
  overlap: number;
  observationTimeS: number | undefined;
  floorBandHz: [number, number] | undefined;
  series: boolean;
}

/** The report: plain JSON (the CLI prints it as it is). */
export interface AnalysisReport {
  input: {
    kind: CaptureKind;
    format: CaptureFormat;
    formatFrom: FormatSource;
    fileName?: string;
    channels: 1 | 2;
    samples: number;
    sampleRateHz: number;
    durationS: number;
  };
  settings: {
    window: WindowName;
    segment: number;
    overlap: number;
    averages: number;
    equivalentAverages: number;
    enbwHz: number;
    detrend: DetrendName;
    frequencyRateHz: number;
  };
  whiteFloor: { valueHz2PerHz: number; bandHz: [number, number] };
  intrinsicLinewidthHz: number;
  betaLine: { observationTimeS: number; crossingHz: number | null; areaHz2: number; linewidthHz: number };
  lineshape: { fwhmHz: number | null };
  noiseModel: { whiteHz2PerHz: number; flickerHz2: number; randomWalkHz3: number; cornerHz: number | null };
  /** narrow lines above the noise model; powerHz2 = the line's power (an FM tone of peak deviation Δ: Δ²/2),
   *  resolutionHz = the bin width the height was read at */
  spurs: (Spur & { powerHz2: number; resolutionHz: number })[];
  /** broad features above the noise model (relaxation-oscillation, servo bumps) */
  bumps: { centerHz: number; widthHz: number; heightDb: number; powerHz2: number }[];
  carrier: { offsetHz: number; driftHzPerS: number; intermediateFrequencyHz?: number };
  /** the band S_ν is trusted in: from the lowest point to fs/2, or to B/2 for a beat note (METHODS 2.2);
   *  `spectrum` (with --series) and the server's display series stop at its top */
  trustedBandHz: [number, number];
  warnings: string[];
  /** how figures were obtained where a documented approximation or exclusion applied (not problems) */
  notes: string[];
  spectrum?: { frequencyHz: number[]; frequencyNoiseHz2PerHz: number[] };
  logSpectrum?: { frequencyHz: number[]; frequencyNoiseHz2PerHz: number[]; averages: number[] };
}

export interface CaptureAnalysis {
  report: AnalysisReport;
  readerInfo: ReaderInfo;
  frequencyStage: FrequencyStageSummary;
  /** every Welch bin of the cascade, each from the finest stage that serves it (stage 0 = full rate) */
  spectrum: LogFrequencySpectrum;
  /** `spectrum` cut at the top of the trusted band (what is shown and exported) */
  trustedSpectrum: Spectrum;
  /** the same binned to LOG_POINTS_PER_DECADE (averages summed over the merged bins) */
  logSpectrum: LogFrequencySpectrum;
  whiteFloor: WhiteFloorReport;
  betaLine: BetaLineReport;
  lineshape: LineshapeReport;
  noiseModel: NoiseModelFitResult;
  spurs: SpurLine[];
  bumps: SpectralBump[];
}

const KINDS: readonly CaptureKind[] = ['phase', 'iq', 'beat', 'frequency'];
const FORMATS: readonly CaptureFormat[] = ['csv', 'npy', 'wav', 'raw'];
const DTYPES: readonly RawDtype[] = ['int16', 'int32', 'float32', 'float64'];
export const DEFAULT_OVERLAP = 0.5;
export const MIN_SEGMENT = 64;
export const MAX_SEGMENT = 2 ** 24;
const DETREND: DetrendName = 'linear';
/** points per decade of the log view the figures are read from */
export const LOG_POINTS_PER_DECADE = 30;
/** share of the progress bar for reading (the rest: spectra, then figures) */
const READ_SHARE = 0.9;

const positiveFinite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v) && v > 0;

/** Checks every option once; throws one AnalysisInputError naming the first broken rule and its value. */
export function resolveAnalyzeOptions(options: AnalyzeOptions): ResolvedAnalyzeOptions {
  const o = options ?? {};
  const bad = (rule: string, value: unknown, option: string): never => {
    throw new AnalysisInputError(`${rule}, got ${JSON.stringify(value) ?? String(value)}`, `option ${option}`);
  };
  if (o.kind !== undefined && !KINDS.includes(o.kind)) bad(`kind must be one of ${KINDS.join(', ')}`, o.kind, 'kind');
  if (o.format !== undefined && !FORMATS.includes(o.format)) bad(`format must be one of ${FORMATS.join(', ')}`, o.format, 'format');
  if (o.sampleRateHz !== undefined && !positiveFinite(o.sampleRateHz)) {
    bad('the sample rate must be a positive number of Hz', o.sampleRateHz, 'sampleRateHz');
  }
  if (o.dtype !== undefined && !DTYPES.includes(o.dtype)) bad(`dtype must be one of ${DTYPES.join(', ')}`, o.dtype, 'dtype');
  if (o.channels !== undefined && o.channels !== 1 && o.channels !== 2) bad('channels must be 1 or 2', o.channels, 'channels');
  if (o.byteOrder !== undefined && o.byteOrder !== 'little' && o.byteOrder !== 'big') {
    bad("byte order must be 'little' or 'big'", o.byteOrder, 'byteOrder');
  }
  const window = o.window ?? 'hann';
  if (!WINDOW_NAMES.includes(window)) bad(`window must be one of ${WINDOW_NAMES.join(', ')}`, window, 'window');
  if (o.segment !== undefined && !(Number.isInteger(o.segment) && o.segment >= MIN_SEGMENT && o.segment <= MAX_SEGMENT)) {
    bad(`the segment must be an integer number of samples in [${MIN_SEGMENT}, ${MAX_SEGMENT}]`, o.segment, 'segment');
  }
  const overlap = o.overlap ?? DEFAULT_OVERLAP;
  if (!(typeof overlap === 'number' && Number.isFinite(overlap) && overlap >= 0 && overlap < 1)) {
    bad('the overlap must be a fraction in [0, 1)', overlap, 'overlap');
  }
  if (o.observationTimeS !== undefined && !positiveFinite(o.observationTimeS)) {
    bad('the observation time must be a positive number of seconds', o.observationTimeS, 'observationTimeS');
  }
  const band = o.floorBandHz;
  if (band !== undefined) {
    if (!Array.isArray(band) || band.length !== 2 || !positiveFinite(band[0]) || !positiveFinite(band[1]) || !(band[0] < band[1])) {
      bad('the floor band must be [lo, hi] Hz with 0 < lo < hi', band, 'floorBandHz');
    }
  }
  if (o.series !== undefined && typeof o.series !== 'boolean') bad('series must be true or false', o.series, 'series');
  if (o.format !== undefined && o.format !== 'raw') {
    for (const key of ['dtype', 'channels', 'byteOrder'] as const) {
      if (o[key] !== undefined) bad(`${key} applies to raw binary files only (the format is ${o.format})`, o[key], key);
    }
  }
  return {
    kind: o.kind,
    format: o.format,
    fileName: o.fileName,
    sampleRateHz: o.sampleRateHz,
    dtype: o.dtype,
    channels: o.channels,
    byteOrder: o.byteOrder,
    window,
    segment: o.segment,
    overlap,
    observationTimeS: o.observationTimeS,
    floorBandHz: band ? [band[0], band[1]] : undefined,
    series: o.series ?? false,
  };
}

/** Default segment: the largest power of two ≤ N/8, within [256, 65536]; 4096 when N is unknown. */
export function defaultSegment(estimatedSamples: number | undefined): number {
  if (estimatedSamples === undefined || !Number.isFinite(estimatedSamples)) return 4096;
  let L = 256;
  while (L * 2 <= estimatedSamples / 8 && L < 65536) L *= 2;
  return L;
}

interface CaptureSettings {
  kind: CaptureKind;
  sampleRateHz: number;
  segment: number;
}

/** What the file tells, merged with the options: resolved once, when the reader knows its header. */
function resolveCapture(o: ResolvedAnalyzeOptions, info: ReaderInfo, estimatedSamples: number | undefined, warnings: string[]): CaptureSettings {
  let fs = o.sampleRateHz;
  if (fs === undefined) fs = info.sampleRateHz;
  else if (info.sampleRateHz !== undefined && Math.abs(info.sampleRateHz / fs - 1) > 1e-9) {
    warnings.push(`the sample rate given (${fs} Hz) overrides the file's (${info.sampleRateHz} Hz)`);
  }
  if (fs === undefined) {
    throw new AnalysisInputError(
      `the sample rate is missing: a ${info.format} file ${info.format === 'csv' ? 'without a time column ' : ''}does not state it, so it must be given`,
      'option sampleRateHz',
    );
  }
  if (!positiveFinite(fs)) {
    throw new AnalysisInputError(`the sample rate must be positive, the file states ${fs} Hz`, 'option sampleRateHz');
  }
  const kind = o.kind ?? inferKind(info);
  if (kind === undefined) {
    throw new AnalysisInputError(
      'the kind of capture is missing: one channel may hold phase, frequency or a beat note, so it must be given',
      'option kind',
    );
  }
  if (kind === 'iq' && info.channelCount !== 2) {
    throw new AnalysisInputError("kind 'iq' needs two channels (I, Q); the file has one", 'option kind');
  }
  if (kind !== 'iq' && info.channelCount !== 1) {
    throw new AnalysisInputError(`kind '${kind}' needs one channel; the file has two (I, Q: kind 'iq')`, 'option kind');
  }
  return { kind, sampleRateHz: fs, segment: o.segment ?? defaultSegment(estimatedSamples) };
}

const toArray = (a: ArrayLike<number>): number[] => Array.from(a);

/**
 * Streams a capture through the analysis and returns the report and the full results.
 * `onProgress(fraction, stage)` is called with stage 'reading', then 'spectrum', then 'figures'.
 */
export async function analyzeCapture(source: CaptureSource, options: AnalyzeOptions, onProgress?: ProgressFn): Promise<CaptureAnalysis> {
  const o = resolveAnalyzeOptions(options);
  const totalBytes = source.totalBytes;
  const warnings: string[] = [];
  let lastFraction = -1;
  let lastStage = '';
  const progress = (fraction: number, stage: string) => {
    if (!onProgress) return;
    if (stage !== lastStage || fraction >= lastFraction + 0.005 || fraction === 1) {
      lastFraction = fraction;
      lastStage = stage;
      onProgress(Math.min(1, fraction), stage);
    }
  };
  progress(0, 'reading');

  let reader: StreamingReader | undefined;
  let formatFrom: FormatSource = 'option';
  let format: CaptureFormat | undefined = o.format;
  const held: Uint8Array[] = [];
  let heldBytes = 0;
  let bytesIn = 0;

  let settings: CaptureSettings | undefined;
  let stage: ReturnType<typeof createFrequencyStage> | undefined;
  let logAcc: ReturnType<typeof createLogFrequencyAccumulator> | undefined;
  let inputSamples = 0;

  const openReader = (head: Uint8Array): StreamingReader => {
    const chosen = chooseFormat(head, o.format, o.fileName);
    format = chosen.format;
    formatFrom = chosen.from;
    if (format !== 'raw') {
      for (const key of ['dtype', 'channels', 'byteOrder'] as const) {
        if (o[key] !== undefined) {
          throw new AnalysisInputError(`${key} applies to raw binary files only (this file is ${format})`, `option ${key}`);
        }
      }
    }
    const channels = o.channels ?? (format === 'raw' && o.kind === 'iq' ? 2 : undefined);
    return createReader({ format, dtype: o.dtype, channels, byteOrder: o.byteOrder, totalBytes });
  };

  const consume = (blocks: SampleBlock[]): void => {
    for (const block of blocks) {
      if (!stage) {
        const info = reader!.info!;
        const estimate =
          info.declaredSamples ??
          (totalBytes !== undefined && bytesIn > 0 ? (totalBytes * reader!.samplesOut) / bytesIn : undefined);
        settings = resolveCapture(o, info, estimate, warnings);
        stage = createFrequencyStage({ kind: settings.kind, sampleRateHz: settings.sampleRateHz });
        logAcc = createLogFrequencyAccumulator({
          sampleRateHz: stage.outputRateHz,
          segmentLength: settings.segment,
          window: o.window,
          overlap: o.overlap,
          detrend: DETREND,
          pointsPerDecade: 0,
        });
        // refuse a record that cannot give two segments before reading it, when its length is known
        // exactly (a header's count or a raw file's size; a beat note's rate changes in the stage)
        const known = info.declaredSamples ?? (format === 'raw' ? estimate : undefined);
        if (known !== undefined && settings.kind !== 'beat') {
          const n = Math.floor(known) - (settings.kind === 'frequency' ? 0 : 1); // differencing drops one
          tooShort(n, settings.segment, logAcc.options.welch.hop);
        }
      }
      inputSamples += block.channels[0].length;
      const nu = stage.push(block);
      if (nu.length > 0) logAcc!.push(nu);
    }
  };

  const feed = (chunk: Uint8Array): void => {
    bytesIn += chunk.length;
    if (!reader) {
      if (o.format === undefined && heldBytes + chunk.length < SNIFF_BYTES) {
        held.push(chunk);
        heldBytes += chunk.length;
        return;
      }
      const head = held.length === 0 ? chunk : concat([...held, chunk]);
      held.length = 0;
      heldBytes = 0;
      reader = openReader(head);
      consume(reader.push(head));
      return;
    }
    consume(reader.push(chunk));
  };

  for await (const chunk of source.chunks) {
    if (chunk.length === 0) continue;
    feed(chunk);
    if (totalBytes) progress((READ_SHARE * Math.min(bytesIn, totalBytes)) / totalBytes, 'reading');
  }
  if (!reader) {
    const head = concat(held);
    reader = openReader(head);
    consume(reader.push(head));
  }
  consume(reader.end());
  const info = reader.info;
  if (!stage || !settings || !logAcc || !info) {
    throw new AnalysisInputError('the file holds no samples', 'byte offset 0');
  }
  const { tail, summary } = stage.finish();
  if (tail.length > 0) logAcc.push(tail);

  progress(READ_SHARE, 'spectrum');
  const L = settings.segment;
  const hop = logAcc.options.welch.hop;
  const n = summary.frequencySamples;
  // segments of the full-rate stage: K = ⌊(n − L)/D⌋ + 1
  const averages = tooShort(n, L, hop);
  const spectrum = logAcc.result();
  const logSpectrum = logBinned(spectrum, LOG_POINTS_PER_DECADE);
  const window = makeWindow(o.window, L);
  const { s1, s2 } = windowSums(window);

  progress(READ_SHARE + 0.05, 'figures');
  const fs = settings.sampleRateHz;
  const durationS = inputSamples / fs;
  const T0 = o.observationTimeS ?? durationS;
  // a beat note is trusted up to about half the demodulator's pass band (METHODS 2.2)
  const trustedTopHz = summary.bandwidthHz !== undefined ? summary.bandwidthHz / 2 : undefined;
  const f = logSpectrum.frequencyHz;
  const topHz = trustedTopHz ?? f[f.length - 1];
  // the model is fitted where the log view is reliable (K ≥ 2, bin ≥ 4): the few points below come
  // from the deepest stage's first bins, biased low by the per-segment detrend (METHODS 1.4)
  const modelLowHz = Math.min(logSpectrum.reliableFromHz, topHz / 10);
  const noiseModel = fitNoiseModel(logSpectrum, { bandHz: [modelLowHz, topHz] });
  const { spurs, bumps } = findSpectralFeatures(spectrum, noiseModel, { bandHz: [modelLowHz, topHz] });
  // the automatic floor search: from the reliable band up to fs/10 of the frequency series (METHODS 2.4)
  // or the trusted top of a beat note, whichever is lower; the fitted flicker/random-walk terms are
  // subtracted from the band's level, and bumps are left out of the search
  const floorMaxHz = Math.min(topHz, stage.outputRateHz / 10);
  const floor = whiteFloor(
    logSpectrum,
    o.floorBandHz !== undefined
      ? { bandHz: o.floorBandHz, spurs }
      : {
          spurs,
          excludeHz: bumps.map((b) => b.spanHz),
          model: noiseModel,
          minHz: logSpectrum.reliableFromHz,
          ...(floorMaxHz > logSpectrum.reliableFromHz ? { maxHz: floorMaxHz } : {}),
        },
  );
  // β-line and lineshape integrate S_ν: the log view's points are bin averages, read linearly so that
  // ∫S df is kept; each spur is taken out of the stitched spectrum (its leakage may show in two cascade
  // stages) and put back as one block of its measured power
  const integrand =
    spurs.length > 0 ? addLineBlocks(logBinned(removeLines(spectrum, spurs), LOG_POINTS_PER_DECADE), spurs) : logSpectrum;
  const beta = betaLine(integrand, { observationTimeS: T0, maxHz: trustedTopHz, interpolation: 'linear' });
  const shape = lineshape(integrand, {
    observationTimeS: T0,
    maxHz: trustedTopHz,
    tailLevelHz2PerHz: floor.valueHz2PerHz,
    interpolation: 'linear',
  });

  warnings.push(...summary.warnings, ...noiseModel.warnings, ...floor.warnings, ...beta.warnings, ...shape.warnings);
  const notes = [...new Set([...noiseModel.notes, ...floor.notes, ...beta.notes, ...shape.notes])];
  if (spurs.length > 0) {
    notes.push(
      `the β-line and the lineshape take ${spurs.length === 1 ? 'the spur' : `each of the ${spurs.length} spurs`} as one line of ` +
        'its measured power, its leakage into neighbouring bins replaced by the background',
    );
  }

  const report: AnalysisReport = {
    input: {
      kind: settings.kind,
      format: format!,
      formatFrom,
      ...(o.fileName !== undefined ? { fileName: o.fileName } : {}),
      channels: info.channelCount,
      samples: inputSamples,
      sampleRateHz: fs,
      durationS,
    },
    settings: {
      window: o.window,
      segment: L,
      overlap: o.overlap,
      averages,
      equivalentAverages: equivalentAverages(window, hop, averages),
      enbwHz: (stage.outputRateHz * s2) / (s1 * s1), // ENBW = fs·Σw²/(Σw)²
      detrend: DETREND,
      frequencyRateHz: stage.outputRateHz,
    },
    whiteFloor: { valueHz2PerHz: floor.valueHz2PerHz, bandHz: floor.bandHz },
    // Δν = π·S_ν,white (Lorentzian FWHM)
    intrinsicLinewidthHz: floor.intrinsicLinewidthHz,
    betaLine: { observationTimeS: beta.observationTimeS, crossingHz: beta.crossingHz, areaHz2: beta.areaHz2, linewidthHz: beta.linewidthHz },
    lineshape: { fwhmHz: shape.fwhmHz },
    noiseModel: {
      whiteHz2PerHz: noiseModel.whiteHz2PerHz,
      flickerHz2: noiseModel.flickerHz2,
      randomWalkHz3: noiseModel.randomWalkHz3,
      cornerHz: noiseModel.cornerHz,
    },
    spurs: spurs.map((s) => ({ frequencyHz: s.frequencyHz, heightDb: s.heightDb, powerHz2: s.powerHz2, resolutionHz: s.resolutionHz })),
    bumps: bumps.map((b) => ({ centerHz: b.centerHz, widthHz: b.widthHz, heightDb: b.heightDb, powerHz2: b.powerHz2 })),
    carrier: {
      offsetHz: summary.carrierOffsetHz,
      driftHzPerS: summary.driftHzPerS,
      ...(summary.intermediateFrequencyHz !== undefined ? { intermediateFrequencyHz: summary.intermediateFrequencyHz } : {}),
    },
    trustedBandHz: [spectrum.frequencyHz[0], trustedTopHz ?? spectrum.frequencyHz[spectrum.frequencyHz.length - 1]],
    warnings,
    notes,
  };
  const trustedSpectrum = trustedTopHz === undefined ? spectrum : cutAbove(spectrum, trustedTopHz);
  if (o.series) {
    report.spectrum = {
      frequencyHz: toArray(trustedSpectrum.frequencyHz),
      frequencyNoiseHz2PerHz: toArray(trustedSpectrum.psd),
    };
    report.logSpectrum = {
      frequencyHz: toArray(logSpectrum.frequencyHz),
      frequencyNoiseHz2PerHz: toArray(logSpectrum.psd),
      averages: toArray(logSpectrum.averages),
    };
  }
  progress(1, 'figures');
  return {
    report,
    readerInfo: info,
    frequencyStage: summary,
    spectrum,
    trustedSpectrum,
    logSpectrum,
    whiteFloor: floor,
    betaLine: beta,
    lineshape: shape,
    noiseModel,
    spurs,
    bumps,
  };
}

/** Segments K = ⌊(n − L)/D⌋ + 1 of n frequency samples; throws when fewer than two. */
function tooShort(n: number, L: number, hop: number): number {
  const segments = n >= L ? Math.floor((n - L) / hop) + 1 : 0;
  if (segments < 2) {
    throw new AnalysisInputError(
      `the record is too short for two segments: ${n} frequency samples, a segment of ${L} ` +
        `with a hop of ${hop} needs at least ${L + hop}; choose a shorter segment`,
    );
  }
  return segments;
}

/** Geometric bins of a stitched spectrum (mean of linear values); averages and resolutions summed. */
function logBinned(s: LogFrequencySpectrum, pointsPerDecade: number): LogFrequencySpectrum {
  const binned = logBinSpectrum(s, { pointsPerDecade });
  const m = binned.counts.length;
  const averages = new Float64Array(m);
  const resolutionHz = new Float64Array(m);
  const stage = new Uint8Array(m);
  let i = 0;
  while (i < s.frequencyHz.length && !(s.frequencyHz[i] > 0)) i++;
  for (let j = 0; j < m; j++) {
    stage[j] = s.stage[i];
    for (let c = 0; c < binned.counts[j]; c++, i++) {
      averages[j] += s.averages[i];
      resolutionHz[j] += s.resolutionHz[i];
    }
  }
  return { ...s, frequencyHz: binned.frequencyHz, psd: binned.psd, averages, resolutionHz, stage };
}

function concat(parts: Uint8Array[]): Uint8Array {
  if (parts.length === 1) return parts[0];
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let p = 0;
  for (const part of parts) {
    out.set(part, p);
    p += part.length;
  }
  return out;
}

/** The points of `s` at or below `topHz` (a view, no copy). */
function cutAbove(s: Spectrum, topHz: number): Spectrum {
  let n = s.frequencyHz.length;
  while (n > 0 && s.frequencyHz[n - 1] > topHz) n -= 1;
  return n === s.frequencyHz.length ? s : { frequencyHz: s.frequencyHz.subarray(0, n), psd: s.psd.subarray(0, n) };
}
