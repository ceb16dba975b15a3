/**
 * The quick check of an upload: the engine's own option check, format choice, reader and preview run
 * over the file's first bytes, so that a file the analysis would refuse at once — an unknown format, a
 * header the reader rejects, a raw file without its dtype, no sample rate or kind where the file
 * cannot tell them — is answered 400 with the engine's message before anything is stored.
 * What the check settles (format, kind, sample rate, channels) is what the capture row records, and
 * what the analysis is later given explicitly.
 * The rules for sample rate, kind and channels follow analysis/pipeline.ts (resolveCapture, openReader),
 * in its words; a later analysis of the whole file applies them again.
 */
import { AnalysisInputError } from '../../../analysis/errors';
import { createReader } from '../../../analysis/io/create-reader';
import { preview } from '../../../analysis/io/preview';
import { chooseFormat } from '../../../analysis/io/sniff';
import { resolveAnalyzeOptions } from '../../../analysis/pipeline';
import type { ByteOrder, CaptureFormat, CaptureKind, ParsedCaptureUploadFields, RawDtype } from '../../contracts/captures';

export interface InspectedCapture {
  format: CaptureFormat;
  kind: CaptureKind;
  sampleRateHz: number;
  dtype: RawDtype | null;
  channels: 1 | 2;
  byteOrder: ByteOrder | null;
}

/** Throws AnalysisInputError (→ 400 bad_input) with the engine's message when the file cannot be analysed as given. */
export function inspectUpload(
  head: Uint8Array,
  sizeBytes: number,
  fileName: string,
  fields: ParsedCaptureUploadFields,
): InspectedCapture {
  const o = resolveAnalyzeOptions({
    kind: fields.kind,
    format: fields.format,
    fileName,
    sampleRateHz: fields.sampleRateHz,
    dtype: fields.dtype,
    channels: fields.channels,
    byteOrder: fields.byteOrder,
    window: fields.window,
    segment: fields.segment,
    overlap: fields.overlap,
    observationTimeS: fields.observationTimeS,
    floorBandHz: fields.floorBandHz,
  });
  if (sizeBytes === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
  const { format } = chooseFormat(head, o.format, fileName);
  if (format !== 'raw') {
    for (const key of ['dtype', 'channels', 'byteOrder'] as const) {
      if (o[key] !== undefined) {
        throw new AnalysisInputError(`${key} applies to raw binary files only (this file is ${format})`, `option ${key}`);
      }
    }
  }
  const readerOptions = {
    format,
    dtype: o.dtype,
    channels: o.channels ?? (format === 'raw' && o.kind === 'iq' ? (2 as const) : undefined),
    byteOrder: o.byteOrder,
    totalBytes: sizeBytes,
  };
  // the reader the analysis will build: refuses a raw file without its dtype, in the engine's words
  createReader(readerOptions);
  const look = preview(head, { ...readerOptions, fileName, complete: head.length === sizeBytes, maxRows: 1 });
  const channels = look.channelCount ?? readerOptions.channels ?? 1;
  const sampleRateHz = o.sampleRateHz ?? look.sampleRateHz;
  if (sampleRateHz === undefined) {
    throw new AnalysisInputError(
      `the sample rate is missing: a ${format} file ${format === 'csv' ? 'without a time column ' : ''}does not state it, so it must be given`,
      'option sampleRateHz',
    );
  }
  const kind = o.kind ?? look.kindGuess;
  if (kind === undefined) {
    throw new AnalysisInputError(
      'the kind of capture is missing: one channel may hold phase, frequency or a beat note, so it must be given',
      'option kind',
    );
  }
  if (kind === 'iq' && channels !== 2) {
    throw new AnalysisInputError("kind 'iq' needs two channels (I, Q); the file has one", 'option kind');
  }
  if (kind !== 'iq' && channels !== 1) {
    throw new AnalysisInputError(`kind '${kind}' needs one channel; the file has two (I, Q: kind 'iq')`, 'option kind');
  }
  return {
    format,
    kind,
    sampleRateHz,
    dtype: format === 'raw' ? (o.dtype ?? null) : null,
    channels,
    byteOrder: format === 'raw' ? (o.byteOrder ?? 'little') : null,
  };
}
