/**
 * Reader factory: the streaming reader for a format, with the options that format takes.
 * Raw files need dtype and channels (byte order defaults to little endian); the other formats
 * describe themselves and take the total file size, when known, to refuse impossible claims early.
 */
import { AnalysisInputError } from '../errors';
import type { ByteOrder, CaptureFormat, RawDtype, StreamingReader } from '../types';
import { CsvReader } from './csv';
import { NpyReader } from './npy';
import { RawReader } from './raw';
import { WavReader } from './wav';

export interface CreateReaderOptions {
  format: CaptureFormat;
  dtype?: RawDtype;
  channels?: 1 | 2;
  byteOrder?: ByteOrder;
  totalBytes?: number;
}

export function createReader(options: CreateReaderOptions): StreamingReader {
  switch (options.format) {
    case 'csv':
      return new CsvReader();
    case 'npy':
      return new NpyReader({ totalBytes: options.totalBytes });
    case 'wav':
      return new WavReader({ totalBytes: options.totalBytes });
    case 'raw':
      if (!options.dtype) {
        throw new AnalysisInputError('a raw binary file needs its dtype (int16, int32, float32 or float64)', 'option dtype');
      }
      return new RawReader({ dtype: options.dtype, channels: options.channels ?? 1, byteOrder: options.byteOrder ?? 'little' });
    default:
      throw new AnalysisInputError(`unknown format '${String(options.format)}' (csv, npy, wav or raw)`, 'option format');
  }
}
