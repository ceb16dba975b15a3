/**
 * The full S_ν series of an analysis as a file in storage — the engine's stitched spectrum, every
 * Welch bin from about 1/T0 to fs/2 (the CLI's `spectrum` with --series; GET series.csv) — in
 * little-endian binary, so that reading it back for a plot is a copy, not a parse.
 *   bytes 0–7   ASCII "PLSERIE1"
 *   bytes 8–11  uint32 n, the number of points
 *   then n float64 frequencies (Hz, ascending), then n float64 S_ν values (Hz²/Hz, one-sided)
 */
const MAGIC = 'PLSERIE1';
const HEADER_BYTES = 12;

export interface Series {
  frequencyHz: Float64Array;
  psd: Float64Array;
}

export function encodeSeries(frequencyHz: ArrayLike<number>, psd: ArrayLike<number>): Uint8Array {
  const n = frequencyHz.length;
  if (psd.length !== n) throw new RangeError(`series lengths differ: ${n} frequencies, ${psd.length} values`);
  const bytes = new Uint8Array(HEADER_BYTES + 16 * n);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < MAGIC.length; i++) bytes[i] = MAGIC.charCodeAt(i);
  view.setUint32(8, n, true);
  let offset = HEADER_BYTES;
  for (let i = 0; i < n; i++, offset += 8) view.setFloat64(offset, frequencyHz[i], true);
  for (let i = 0; i < n; i++, offset += 8) view.setFloat64(offset, psd[i], true);
  return bytes;
}

export function decodeSeries(bytes: Uint8Array): Series {
  const magic = String.fromCharCode(...bytes.subarray(0, MAGIC.length));
  if (bytes.length < HEADER_BYTES || magic !== MAGIC) throw new Error('not a series file (bad magic)');
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const n = view.getUint32(8, true);
  if (bytes.length !== HEADER_BYTES + 16 * n) {
    throw new Error(`series file holds ${bytes.length} bytes, its header says ${HEADER_BYTES + 16 * n}`);
  }
  const frequencyHz = new Float64Array(n);
  const psd = new Float64Array(n);
  let offset = HEADER_BYTES;
  for (let i = 0; i < n; i++, offset += 8) frequencyHz[i] = view.getFloat64(offset, true);
  for (let i = 0; i < n; i++, offset += 8) psd[i] = view.getFloat64(offset, true);
  return { frequencyHz, psd };
}
