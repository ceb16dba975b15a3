/**
 * Shared types of the analysis engine: the contracts between its stages.
 * reader (io/) -> phase stage (phase/) -> spectrum accumulators (spectrum/) -> figures (linewidth/, noise/)
 * All arrays are typed arrays; no stage mutates what it is given.
 * Units: Hz, seconds, radians; every S_ν is one-sided in Hz²/Hz.
 */

export type CaptureKind = 'phase' | 'iq' | 'beat' | 'frequency';
export type CaptureFormat = 'csv' | 'npy' | 'wav' | 'raw';
export type RawDtype = 'int16' | 'int32' | 'float32' | 'float64';
export type ByteOrder = 'little' | 'big';
export type WindowName = 'hann' | 'blackman-harris' | 'flat-top';

/** One block of samples out of a reader. `channels` has length 1 (real) or 2 (I, Q), equal lengths. */
export interface SampleBlock {
  channels: Float64Array[];
}

/** What a reader learned from the file itself (header, time column). Never used to allocate. */
export interface ReaderInfo {
  format: CaptureFormat;
  channelCount: 1 | 2;
  /** sample rate the file states (WAV header, CSV time column), if any */
  sampleRateHz?: number;
  /** sample count the header claims, if any (checked against the bytes actually present) */
  declaredSamples?: number;
  /** free-form facts for a preview: column names, dtype, byte order, header fields */
  details: Record<string, string | number | boolean>;
}

/** A streaming reader: bytes in, blocks of samples out, bounded memory. */
export interface StreamingReader {
  /** Feed the next chunk of the file; returns the sample blocks completed by it (possibly none). */
  push(chunk: Uint8Array): SampleBlock[];
  /** The file has ended; returns the last blocks, or throws AnalysisInputError if truncated. */
  end(): SampleBlock[];
  /** Known once the header has been read (after the first push that completes it). */
  readonly info: ReaderInfo | undefined;
  /** Samples (per channel) emitted so far. */
  readonly samplesOut: number;
}

/** A one-sided frequency-noise PSD on some frequency grid (linear Welch grid or log grid). */
export interface Spectrum {
  frequencyHz: Float64Array;
  /** S_ν(f), one-sided, Hz²/Hz */
  psd: Float64Array;
}

export interface WhiteFloor {
  valueHz2PerHz: number;
  bandHz: [number, number];
}

/** The white floor with how it was found (analysis/linewidth/white-floor.ts). */
export interface WhiteFloorResult extends WhiteFloor {
  /** Lorentzian FWHM π·S_ν,white, Hz */
  intrinsicLinewidthHz: number;
  /** 'auto': flattest low band found by the search; 'band': mean over the band the caller gave */
  mode: 'auto' | 'band';
  /** grid points averaged (after spur exclusion) */
  pointCount: number;
  /** log-log slope d ln S_ν / d ln f fitted over the band (0 for a pure white floor) */
  slope: number;
  warnings: string[];
}

export interface BetaLineResult {
  observationTimeS: number;
  /**
   * highest frequency where S_ν falls below β(f) = 8 ln2 f / π² (it may lie below 1/T0: then the line is
   * carrier-dominated); null when S_ν never exceeds β in the band, or is still above it at the top (truncated)
   */
  crossingHz: number | null;
  areaHz2: number;
  /** √(8 ln2 · A) */
  linewidthHz: number;
  /** S_ν is still above β(f) at the top of the band: the area (and the linewidth) are lower bounds */
  truncated: boolean;
  /** 1/T0 ≥ f_x (A = 0): the line is a coherent carrier at this T0 */
  carrierDominated: boolean;
  /** the intervals [lo, hi] (Hz) above 1/T0 where S_ν > β, whose union gives the area */
  intervalsHz: [number, number][];
  warnings: string[];
}

export interface LineshapeResult {
  /** null when the line is dominated by a coherent carrier at this T0 (FWHM resolution-limited) */
  fwhmHz: number | null;
  carrierDominated: boolean;
  /** a sampled lineshape for display: offset from the centre (Hz, >= 0) and power normalised to 1 at 0 */
  offsetHz: Float64Array;
  power: Float64Array;
  observationTimeS: number;
  /** Γ(τ→∞) = exp(−∫_{1/T0}^∞ S_ν/f² df): the fraction of the power left in the coherent carrier */
  carrierFraction: number;
  /** white level appended analytically above the top of the grid, Hz²/Hz */
  tailLevelHz2PerHz: number;
  warnings: string[];
}

export interface NoiseModel {
  /** a₀ in S_ν = a₀ + a₋₁/f + a₋₂/f² */
  whiteHz2PerHz: number;
  /** a₋₁ */
  flickerHz2: number;
  /** a₋₂ */
  randomWalkHz3: number;
  /** frequency where a₋₁/f = a₀ (null when a₋₁ <= 0 or a₀ <= 0) */
  cornerHz: number | null;
  bandHz: [number, number];
}

/** A fitted noise model with how the fit went (analysis/noise/model-fit.ts). */
export interface NoiseModelFit extends NoiseModel {
  /** grid points used (after excluding points standing > 10 dB above the model) */
  pointCount: number;
  /** points left out as spurs */
  excludedCount: number;
  iterations: number;
  /** Σ (S − M)²/M² / (n − p): ≈ 1/K_eff for a χ²-distributed Welch estimate that fits */
  reducedChiSquare: number;
  warnings: string[];
}

export interface Spur {
  frequencyHz: number;
  /** height above the noise model, dB */
  heightDb: number;
}

/** Progress callback: fraction 0..1 of the work and the stage name. */
export type ProgressFn = (fraction: number, stage: string) => void;

// ---- phase and spectrum stages (analysis/phase/, analysis/spectrum/) ----

export type DetrendName = 'constant' | 'linear';
/** 'density': one-sided PSD, unit²/Hz; 'spectrum': one-sided power spectrum, unit² (a sine of amplitude A on a bin reads A²/2) */
export type SpectrumScaling = 'density' | 'spectrum';

/** A Welch estimate on the linear grid f_m = m·fs/L, m = 0..⌊L/2⌋ (analysis/spectrum/welch.ts). */
export interface WelchSpectrum extends Spectrum {
  sampleRateHz: number;
  window: WindowName;
  segmentLength: number;
  /** hop D between segment starts, samples (overlap = L − D) */
  hop: number;
  detrend: DetrendName;
  scaling: SpectrumScaling;
  /** number of segments averaged, K */
  averages: number;
  /** equivalent number of independent averages K_eff (Welch 1967; METHODS 1.3) */
  equivalentAverages: number;
  /** equivalent noise bandwidth fs·Σw²/(Σw)², Hz (the RBW of a bin) */
  enbwHz: number;
  /** samples pushed in, and samples covered by the K segments */
  samplesSeen: number;
  samplesUsed: number;
}

/** A stitched multi-resolution estimate on a log-spaced grid (analysis/spectrum/log-frequency.ts). */
export interface LogFrequencySpectrum extends Spectrum {
  /** segments averaged behind each point (K of its stage; summed over merged bins after log binning) */
  averages: Float64Array;
  /** frequency resolution fs_stage/L behind each point, Hz */
  resolutionHz: Float64Array;
  /** decimation stage behind each point (0 = full rate, s = rate fs/2^s) */
  stage: Uint8Array;
  /** lowest frequency meeting the stitching rule (bin ≥ minBin, K ≥ minAverages); points below it are the
   *  deepest stage's first bins, reaching down to between 1/T0 and ≈2/T0 (few averages: indicative) */
  reliableFromHz: number;
  sampleRateHz: number;
  segmentLength: number;
  window: WindowName;
  samplesSeen: number;
}

/** What the phase stage learned while turning a capture into frequency samples (analysis/phase/frequency-stage.ts). */
export interface FrequencyStageSummary {
  kind: CaptureKind;
  /** samples (per channel) pushed in */
  inputSamples: number;
  /** frequency samples emitted */
  frequencySamples: number;
  /** rate of the frequency samples, Hz (input rate / decimation) */
  outputRateHz: number;
  /** mean frequency of the record, Hz (for a beat note: the mean beat frequency, IF included) */
  carrierOffsetHz: number;
  /** least-squares slope of the frequency against time, Hz/s */
  driftHzPerS: number;
  /** beat note only: the intermediate frequency used for the mix-down, and how it was obtained */
  intermediateFrequencyHz?: number;
  intermediateFrequencySource?: 'given' | 'spectrum-peak';
  /** beat note only: flat pass band ±B of the complex low-pass, Hz; S_ν is trusted up to about B/2 */
  bandwidthHz?: number;
  /** IQ/beat: samples whose |z|² fell below 1e-6 × the running mean |z|² (random phase) */
  lowAmplitudeSamples: number;
  /** samples whose wrapped phase step exceeded 0.8π (unwrapping may have failed) */
  largeStepSamples: number;
  warnings: string[];
}
