/**
 * The quick check of an upload: the engine's own reader runs over the file's first bytes (the same
 * `preview` the browser's upload form shows), so that a file the analysis would refuse at once — an
 * unknown format, a header the reader rejects, a raw file without its dtype, no sample rate where
 * the format cannot tell it — is answered 400 with the engine's message before anything is stored.
 * What the check settles (format, kind, sample rate, channels) is what the capture row records.
 */
import { AnalysisInputError } from '../../../analysis/errors';
import { createReader } from '../../../analysis/io/create-reader';
import { preview } from '../../../analysis/io/preview';
import { chooseFormat } from '../../../analysis/io/sniff';
import type { ByteOrder, CaptureFormat, CaptureKind, ParsedCaptureUploadFields, RawDtype } from '../../contracts/captures';

export interface InspectedCapture {
  format: CaptureFormat;
  kind: CaptureKind;
  sampleRateHz: number;
  dtype: RawDtype | null;
  channels: 1 | 2 | null;
  byteOrder: ByteOrder | null;
}

/** Throws AnalysisInputError (→ 400 bad_input) with the engine's message when the file cannot be analysed as given. */
export function inspectUpload(
  head: Uint8Array,
  sizeBytes: number,
  fileName: string,
  fields: ParsedCaptureUploadFields,
): InspectedCapture {
  const { format } = chooseFormat(head, fields.format, fileName);
  const readerOptions = {
    format,
    dtype: fields.dtype,
    channels: fields.channels,
    byteOrder: fields.byteOrder,
    totalBytes: sizeBytes,
  };
  // The reader the analysis will build: refuses a raw file without its dtype, in the engine's words.
  createReader(readerOptions);
  const look = preview(head, { ...readerOptions, fileName, complete: head.length === sizeBytes, maxRows: 1 });
  const sampleRateHz = fields.sampleRateHz ?? look.sampleRateHz;
  if (sampleRateHz === undefined) {
    throw new AnalysisInputError(
      `a ${format} file like this one does not state its sample rate; give the sample rate (Hz)`,
      'option sampleRateHz',
    );
  }
  const kind = fields.kind ?? look.kindGuess;
  if (kind === undefined) {
    throw new AnalysisInputError('cannot tell what the samples are; give the kind (phase, iq, beat or frequency)', 'option kind');
  }
  const channels = look.channelCount ?? fields.channels ?? null;
  if (kind === 'iq' && channels === 1) {
    throw new AnalysisInputError('an IQ capture needs two channels (I and Q); this file has one', 'option kind');
  }
  if (kind !== 'iq' && channels === 2) {
    throw new AnalysisInputError(`a ${kind} capture has one channel; this file has two (I and Q?): give kind iq`, 'option kind');
  }
  return {
    format,
    kind,
    sampleRateHz,
    dtype: format === 'raw' ? (fields.dtype ?? null) : null,
    channels,
    byteOrder: format === 'raw' ? (fields.byteOrder ?? 'little') : null,
  };
}
