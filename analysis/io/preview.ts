/**
 * Preview of a capture from its first bytes: what an upload form shows before anything is sent —
 * the format (and how it was told), the header fields, the first sample rows, the sample rate and
 * channel count the file states, a guessed kind, and what the user must still give.
 * Runs the same readers as the analysis on a prefix of the file (never past `maxRows` rows).
 * Free of node:* imports: the browser uses it on the first slice of a File.
 * Check: preview of "time,phase\n0,0.1\n0.5,0.2\n" -> csv, 1 channel, 2 Hz, kind 'phase', rows [[0.1], [0.2]].
 */
import { AnalysisInputError } from '../errors';
import type { ByteOrder, CaptureFormat, CaptureKind, RawDtype, ReaderInfo, SampleBlock } from '../types';
import { createReader } from './create-reader';
import { type FormatSource, chooseFormat } from './sniff';

export interface PreviewOptions {
  fileName?: string;
  /** an explicit format wins over sniffing */
  format?: CaptureFormat;
  dtype?: RawDtype;
  channels?: 1 | 2;
  byteOrder?: ByteOrder;
  /** true when `bytes` is the whole file (then truncation is reported too) */
  complete?: boolean;
  /** total file size, when known */
  totalBytes?: number;
  /** sample rows to return (default 10) */
  maxRows?: number;
}

export type PreviewNeed = 'sampleRateHz' | 'kind' | 'dtype';

export interface CapturePreview {
  format: CaptureFormat;
  formatFrom: FormatSource;
  channelCount?: 1 | 2;
  sampleRateHz?: number;
  declaredSamples?: number;
  /** estimated sample count from the file size (raw, npy, wav) */
  estimatedSamples?: number;
  kindGuess?: CaptureKind;
  /** header fields, column names, dtype… as the reader found them */
  fields: Record<string, string | number | boolean>;
  /** the first sample frames, one array per frame ([x] or [I, Q]) */
  rows: number[][];
  /** CSV: the first lines as written */
  textLines?: string[];
  /** what the file cannot tell and the user must give */
  needs: PreviewNeed[];
}

const KINDS: readonly CaptureKind[] = ['phase', 'iq', 'beat', 'frequency'];

/** The kind a reader's findings imply: two channels -> iq; a CSV column name; else undefined. */
export function inferKind(info: ReaderInfo): CaptureKind | undefined {
  if (info.channelCount === 2) return 'iq';
  const hint = info.details.kindHint;
  return typeof hint === 'string' && (KINDS as readonly string[]).includes(hint) ? (hint as CaptureKind) : undefined;
}

export function preview(bytes: Uint8Array, options: PreviewOptions = {}): CapturePreview {
  const maxRows = options.maxRows ?? 10;
  const { format, from } = chooseFormat(bytes, options.format, options.fileName);
  const fields: Record<string, string | number | boolean> = {};
  const needs: PreviewNeed[] = [];
  if (format === 'raw' && !options.dtype) {
    return { format, formatFrom: from, fields, rows: [], needs: ['dtype', 'sampleRateHz', 'kind'] };
  }
  const reader = createReader({ ...options, format, totalBytes: options.totalBytes });
  let data = bytes;
  let textLines: string[] | undefined;
  if (format === 'csv') {
    // only whole lines; the prefix is then read as if it were the file
    const last = options.complete ? bytes.length : bytes.lastIndexOf(0x0a) + 1;
    data = bytes.subarray(0, last);
    textLines = new TextDecoder('utf-8').decode(data.subarray(0, Math.min(data.length, 4096))).split(/\r?\n/).slice(0, maxRows + 2);
    if (textLines.length > 0 && textLines[textLines.length - 1] === '') textLines.pop();
  }
  const blocks: SampleBlock[] = [...reader.push(data)];
  if (options.complete || format === 'csv') blocks.push(...reader.end());
  const info = reader.info;
  if (!info) {
    throw new AnalysisInputError(`the first ${bytes.length} bytes do not hold the whole ${format} header`, `byte offset ${bytes.length}`);
  }
  const rows: number[][] = [];
  for (const b of blocks) {
    const n = b.channels[0].length;
    for (let i = 0; i < n && rows.length < maxRows; i++) rows.push(b.channels.map((ch) => ch[i]));
  }
  Object.assign(fields, info.details);
  let estimatedSamples: number | undefined;
  const total = options.totalBytes ?? (options.complete ? bytes.length : undefined);
  if (total !== undefined) {
    if (format === 'raw') estimatedSamples = Math.floor(total / Number(info.details.frameBytes));
    else if (info.declaredSamples !== undefined) estimatedSamples = info.declaredSamples;
  }
  const kindGuess = inferKind(info);
  if (info.sampleRateHz === undefined) needs.push('sampleRateHz');
  if (kindGuess === undefined) needs.push('kind');
  return {
    format,
    formatFrom: from,
    channelCount: info.channelCount,
    sampleRateHz: info.sampleRateHz,
    declaredSamples: info.declaredSamples,
    estimatedSamples,
    kindGuess,
    fields,
    rows,
    textLines,
    needs,
  };
}
