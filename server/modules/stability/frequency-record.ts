/**
 * The frequency record of a stored capture, for the Allan deviation: the bytes streamed through the
 * engine's reader and frequency stage (analysis/io, analysis/phase/frequency-stage.ts — the same path the
 * analysis job takes), the instantaneous frequency ν_i [Hz] kept in memory up to a bound.
 * Bound: at most `maxSamples` values. When the record is longer, adjacent pairs are averaged (and again,
 * as often as needed): the mean frequency over 2^k samples is the phase difference over 2^k τ0 divided by
 * 2π·2^k τ0, so the decimated record is exactly the phase record sampled every 2^k τ0 — the Allan
 * deviation at τ = m·2^k τ0 is unchanged; only τ shorter than 2^k τ0 are lost (reported as `decimation`).
 * Memory: maxSamples doubles (default 2^22, 32 MiB) plus one chunk of the file.
 */
import { createReader } from '../../../analysis/io/create-reader';
import { AnalysisInputError } from '../../../analysis/errors';
import { createFrequencyStage } from '../../../analysis/phase/frequency-stage';
import type { ByteOrder, CaptureFormat, CaptureKind, RawDtype } from '../../../analysis/types';

export interface RecordSource {
  kind: CaptureKind;
  format: CaptureFormat;
  sampleRateHz: number | null;
  dtype: RawDtype | null;
  channels: 1 | 2 | null;
  byteOrder: ByteOrder | null;
  sizeBytes: number;
}

export interface FrequencyRecord {
  /** ν averaged over `decimation` samples, Hz */
  frequencyHz: Float64Array;
  /** spacing of frequencyHz, s */
  sampleIntervalS: number;
  /** frequency samples averaged into one (a power of two) */
  decimation: number;
  /** frequency samples the stage produced */
  frequencySamples: number;
}

export const DEFAULT_MAX_RECORD = 2 ** 22;

export async function readFrequencyRecord(
  chunks: AsyncIterable<Uint8Array>,
  source: RecordSource,
  maxSamples = DEFAULT_MAX_RECORD,
): Promise<FrequencyRecord> {
  const reader = createReader({
    format: source.format,
    ...(source.format === 'raw'
      ? { dtype: source.dtype ?? undefined, channels: source.channels ?? (source.kind === 'iq' ? 2 : undefined), byteOrder: source.byteOrder ?? undefined }
      : {}),
    totalBytes: source.sizeBytes,
  });
  let stage: ReturnType<typeof createFrequencyStage> | undefined;
  const buffer = new Float64Array(maxSamples);
  let filled = 0;
  let decimation = 1;
  let total = 0;
  // the running sum of the current group of `decimation` samples
  let groupSum = 0;
  let groupCount = 0;

  const add = (nu: Float64Array) => {
    for (let i = 0; i < nu.length; i++) {
      total++;
      groupSum += nu[i];
      if (++groupCount < decimation) continue;
      if (filled === maxSamples) {
        // halve: average adjacent pairs in place; the group size doubles
        for (let j = 0; j < maxSamples / 2; j++) buffer[j] = 0.5 * (buffer[2 * j] + buffer[2 * j + 1]);
        filled = maxSamples / 2;
        decimation *= 2;
        // this sample begins a new group of the doubled size
        groupCount = decimation / 2;
        continue;
      }
      buffer[filled++] = groupSum / decimation;
      groupSum = 0;
      groupCount = 0;
    }
  };

  const consume = (blocks: ReturnType<typeof reader.push>) => {
    for (const block of blocks) {
      if (!stage) {
        const info = reader.info!;
        const fs = source.sampleRateHz ?? info.sampleRateHz;
        if (!(typeof fs === 'number' && fs > 0)) throw new AnalysisInputError('the sample rate is missing: the capture does not state it');
        stage = createFrequencyStage({ kind: source.kind, sampleRateHz: fs });
      }
      const nu = stage.push(block);
      if (nu.length > 0) add(nu);
    }
  };

  for await (const chunk of chunks) if (chunk.length > 0) consume(reader.push(chunk));
  consume(reader.end());
  if (!stage) throw new AnalysisInputError('the file holds no samples');
  const { tail } = stage.finish();
  if (tail.length > 0) add(tail);
  return {
    frequencyHz: buffer.slice(0, filled),
    sampleIntervalS: decimation / stage.outputRateHz,
    decimation,
    frequencySamples: total,
  };
}
