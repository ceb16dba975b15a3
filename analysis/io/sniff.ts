/**
 * Format sniffing: which reader a capture needs, from its first bytes and its name.
 * Order: an explicit choice always wins; then magic bytes ("\x93NUMPY" -> npy; "RIFF"/"RF64" with
 * "WAVE" at byte 8 -> wav); then text-looking bytes -> csv; then the file extension
 * (.npy, .wav, .csv/.tsv/.txt, .bin/.raw/.dat/.iq/.f32/.f64/.i16/.i32 -> raw).
 * "Text-looking": the first 4096 bytes hold no NUL, at least one digit, and ≥ 98 % of them are
 * printable ASCII, tab, CR, LF or bytes of UTF-8 sequences.
 * Free of node:* imports: the browser's upload form uses it too.
 * Check: sniffFormat(bytes of "0.1,0.2\n") -> { format: 'csv', from: 'text' }.
 */
import { AnalysisInputError } from '../errors';
import type { CaptureFormat } from '../types';

export type FormatSource = 'option' | 'magic' | 'text' | 'extension';

export interface SniffResult {
  format: CaptureFormat;
  from: FormatSource;
}

/** bytes the sniffer looks at */
export const SNIFF_BYTES = 4096;

const EXTENSIONS: Record<string, CaptureFormat> = {
  npy: 'npy',
  wav: 'wav',
  wave: 'wav',
  csv: 'csv',
  tsv: 'csv',
  txt: 'csv',
  bin: 'raw',
  raw: 'raw',
  dat: 'raw',
  iq: 'raw',
  f32: 'raw',
  f64: 'raw',
  i16: 'raw',
  i32: 'raw',
};

const startsWith = (b: Uint8Array, at: number, text: string): boolean => {
  if (b.length < at + text.length) return false;
  for (let i = 0; i < text.length; i++) if (b[at + i] !== text.charCodeAt(i)) return false;
  return true;
};

export function hasNpyMagic(head: Uint8Array): boolean {
  return head.length >= 6 && head[0] === 0x93 && startsWith(head, 1, 'NUMPY');
}

export function hasWavMagic(head: Uint8Array): boolean {
  return (startsWith(head, 0, 'RIFF') || startsWith(head, 0, 'RF64')) && startsWith(head, 8, 'WAVE');
}

/** Do the first bytes look like text (CSV/TSV)? */
export function looksLikeText(head: Uint8Array): boolean {
  const n = Math.min(head.length, SNIFF_BYTES);
  if (n === 0) return false;
  let odd = 0;
  let digits = 0;
  for (let i = 0; i < n; i++) {
    const c = head[i];
    if (c === 0) return false;
    if (c >= 0x30 && c <= 0x39) digits++;
    const printable = (c >= 0x20 && c < 0x7f) || c === 0x09 || c === 0x0a || c === 0x0d || c >= 0x80;
    if (!printable) odd++;
  }
  if (digits === 0 || odd > n * 0.02) return false;
  // bytes ≥ 0x80 must form valid UTF-8 (a cut sequence at the very end is allowed)
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(head.subarray(0, n), { stream: true });
  } catch {
    return false;
  }
  return true;
}

export function extensionOf(fileName: string | undefined): string {
  if (!fileName) return '';
  const base = fileName.split(/[\\/]/).pop() ?? '';
  const dot = base.lastIndexOf('.');
  return dot > 0 ? base.slice(dot + 1).toLowerCase() : '';
}

/** The format the bytes and the name suggest, or undefined when they say nothing. */
export function sniffFormat(head: Uint8Array, fileName?: string): SniffResult | undefined {
  if (hasNpyMagic(head)) return { format: 'npy', from: 'magic' };
  if (hasWavMagic(head)) return { format: 'wav', from: 'magic' };
  if (looksLikeText(head)) return { format: 'csv', from: 'text' };
  const ext = EXTENSIONS[extensionOf(fileName)];
  if (ext) return { format: ext, from: 'extension' };
  return undefined;
}

/** The explicit format when given, else the sniffed one; throws when neither tells. */
export function chooseFormat(head: Uint8Array, explicit?: CaptureFormat, fileName?: string): SniffResult {
  if (explicit) return { format: explicit, from: 'option' };
  if (head.length === 0) throw new AnalysisInputError('the file is empty', 'byte offset 0');
  const found = sniffFormat(head, fileName);
  if (!found) {
    throw new AnalysisInputError(
      'cannot tell the file format from its first bytes or its name; give the format (csv, npy, wav or raw)',
      'byte offset 0',
    );
  }
  return found;
}
