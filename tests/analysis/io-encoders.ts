/**
 * Tiny independent encoders for the reader tests: NumPy .npy, WAV, raw frames and a chunked reader
 * driver. Written from the format descriptions (NEP 1; the RIFF/WAVE specification), not from the
 * readers, so that a round trip checks the readers against a second reading of the formats.
 */
import type { SampleBlock, StreamingReader } from '../../analysis/types';

export type TestElement = 'i2' | 'i3' | 'i4' | 'f4' | 'f8';

const SIZE: Record<TestElement, number> = { i2: 2, i3: 3, i4: 4, f4: 4, f8: 8 };

export function writeElement(dv: DataView, at: number, v: number, el: TestElement, little: boolean): void {
  switch (el) {
    case 'i2':
      dv.setInt16(at, v, little);
      break;
    case 'i4':
      dv.setInt32(at, v, little);
      break;
    case 'f4':
      dv.setFloat32(at, v, little);
      break;
    case 'f8':
      dv.setFloat64(at, v, little);
      break;
    case 'i3': {
      const u = v & 0xffffff;
      const b = [u & 0xff, (u >> 8) & 0xff, (u >> 16) & 0xff];
      if (!little) b.reverse();
      for (let i = 0; i < 3; i++) dv.setUint8(at + i, b[i]);
    }
  }
}

/** Frames [[x], …] or [[I, Q], …] -> interleaved bytes. */
export function encodeFrames(frames: number[][], el: TestElement, little: boolean): Uint8Array {
  const size = SIZE[el];
  const channels = frames.length ? frames[0].length : 1;
  const out = new Uint8Array(frames.length * channels * size);
  const dv = new DataView(out.buffer);
  let p = 0;
  for (const f of frames) {
    for (const v of f) {
      writeElement(dv, p, v, el, little);
      p += size;
    }
  }
  return out;
}

const ascii = (s: string): Uint8Array => Uint8Array.from(s, (c) => c.charCodeAt(0));

export function concatBytes(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let p = 0;
  for (const part of parts) {
    out.set(part, p);
    p += part.length;
  }
  return out;
}

export interface NpyOptions {
  version?: 1 | 2 | 3;
  /** the dict text between the braces; default built from descr/fortran/shape */
  dict?: string;
  fortran?: boolean;
  /** overrides the header length field */
  headerLengthField?: number;
}

/** An .npy file: header padded with spaces and '\n' so that the data starts at a multiple of 64. */
export function encodeNpy(descr: string, shape: number[], data: Uint8Array, o: NpyOptions = {}): Uint8Array {
  const version = o.version ?? 1;
  const shapeText = shape.length === 1 ? `(${shape[0]},)` : `(${shape.join(', ')})`;
  const dict = o.dict ?? `{'descr': '${descr}', 'fortran_order': ${o.fortran ? 'True' : 'False'}, 'shape': ${shapeText}, }`;
  const preamble = version === 1 ? 10 : 12;
  let header = dict;
  const total = Math.ceil((preamble + header.length + 1) / 64) * 64;
  header = header + ' '.repeat(total - preamble - header.length - 1) + '\n';
  const headerBytes = version === 3 ? new TextEncoder().encode(header) : ascii(header);
  const pre = new Uint8Array(preamble);
  pre.set([0x93, ...ascii('NUMPY'), version, 0]);
  const dv = new DataView(pre.buffer);
  const len = o.headerLengthField ?? headerBytes.length;
  if (version === 1) dv.setUint16(8, len, true);
  else dv.setUint32(8, len, true);
  return concatBytes(pre, headerBytes, data);
}

export interface WavOptions {
  /** 1 PCM, 3 float, 0xfffe extensible */
  formatTag: number;
  /** sub-format code for extensible (1 or 3) */
  subFormat?: number;
  /** corrupt the GUID tail */
  badGuid?: boolean;
  bits: number;
  channels: number;
  rate: number;
  /** chunks before the fmt chunk and between fmt and data */
  before?: { id: string; bytes: Uint8Array }[];
  after?: { id: string; bytes: Uint8Array }[];
  dataSizeField?: number;
  riffSizeField?: number;
}

function chunk(id: string, bytes: Uint8Array, sizeField?: number): Uint8Array {
  const head = new Uint8Array(8);
  head.set(ascii(id));
  new DataView(head.buffer).setUint32(4, sizeField ?? bytes.length, true);
  const pad = bytes.length % 2 ? new Uint8Array(1) : new Uint8Array(0);
  return concatBytes(head, bytes, pad);
}

export function encodeWav(data: Uint8Array, o: WavOptions): Uint8Array {
  const extensible = o.formatTag === 0xfffe;
  const fmt = new Uint8Array(extensible ? 40 : o.formatTag === 3 ? 18 : 16);
  const dv = new DataView(fmt.buffer);
  dv.setUint16(0, o.formatTag, true);
  dv.setUint16(2, o.channels, true);
  dv.setUint32(4, o.rate, true);
  dv.setUint32(8, (o.rate * o.channels * o.bits) / 8, true);
  dv.setUint16(12, (o.channels * o.bits) / 8, true);
  dv.setUint16(14, o.bits, true);
  if (fmt.length >= 18) dv.setUint16(16, extensible ? 22 : 0, true);
  if (extensible) {
    dv.setUint16(18, o.bits, true);
    dv.setUint32(20, o.channels === 2 ? 3 : 4, true);
    dv.setUint32(24, o.subFormat ?? 1, true);
    fmt.set([0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, o.badGuid ? 0x72 : 0x71], 28);
  }
  const body = concatBytes(
    ascii('WAVE'),
    ...(o.before ?? []).map((c) => chunk(c.id, c.bytes)),
    chunk('fmt ', fmt),
    chunk('data', data, o.dataSizeField),
    ...(o.after ?? []).map((c) => chunk(c.id, c.bytes)),
  );
  return concatBytes(chunk('RIFF', body, o.riffSizeField));
}

/** A small deterministic generator (mulberry32) for chunk sizes and test values. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export type Chunking = 'whole' | 'bytewise' | { randomSeed: number; maxChunk: number };

/** Feeds `bytes` to a reader in chunks, ends it, and returns the concatenated channels. */
export function readAll(reader: StreamingReader, bytes: Uint8Array, chunking: Chunking = 'whole'): number[][] {
  const blocks: SampleBlock[] = [];
  if (chunking === 'whole') blocks.push(...reader.push(bytes));
  else if (chunking === 'bytewise') {
    for (let i = 0; i < bytes.length; i++) blocks.push(...reader.push(bytes.subarray(i, i + 1)));
  } else {
    const rnd = seeded(chunking.randomSeed);
    let p = 0;
    while (p < bytes.length) {
      const n = Math.min(bytes.length - p, 1 + Math.floor(rnd() * chunking.maxChunk));
      // copy into a fresh, possibly misaligned buffer as a stream would hand it over
      const shift = Math.floor(rnd() * 4);
      const buf = new Uint8Array(n + shift);
      buf.set(bytes.subarray(p, p + n), shift);
      blocks.push(...reader.push(buf.subarray(shift)));
      p += n;
    }
  }
  blocks.push(...reader.end());
  const channels = reader.info ? reader.info.channelCount : 1;
  const out: number[][] = Array.from({ length: channels }, () => []);
  for (const b of blocks) {
    if (b.channels.length !== channels) throw new Error('block channel count differs from info');
    b.channels.forEach((ch, c) => {
      for (const v of ch) out[c].push(v);
    });
  }
  return out;
}

export const textBytes = (s: string): Uint8Array => new TextEncoder().encode(s);
