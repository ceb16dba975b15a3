/**
 * Frame decoder: interleaved binary sample frames -> one Float64Array per channel.
 * Shared by the NumPy, WAV and raw readers. A frame is `channels` elements stored one after the
 * other (I then Q for two channels); elements are two's-complement integers (16, 24 or 32 bit) or
 * IEEE 754 binary32/binary64, in either byte order.
 * Units: integers keep their counts (no scaling to full scale), floats keep their values.
 * Chunks may split anywhere, even inside an element: the bytes of an incomplete frame are carried
 * to the next call (at most one frame, ≤ 16 bytes). Memory: one output block per call, sized by the
 * bytes actually given, never by what a header claims.
 * Check: the bytes 00 80 (int16, little endian) decode to -32768; 3F 80 00 00 (float32, big) to 1.
 * Common practice, no source: WAV, NumPy and instrument dumps all store frames this way.
 */
import type { SampleBlock } from '../types';

export type ElementType = 'int16' | 'int24' | 'int32' | 'float32' | 'float64';

export interface FrameLayout {
  element: ElementType;
  littleEndian: boolean;
  channels: 1 | 2;
}

export const ELEMENT_BYTES: Record<ElementType, number> = {
  int16: 2,
  int24: 3,
  int32: 4,
  float32: 4,
  float64: 8,
};

const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

export class FrameDecoder {
  readonly frameBytes: number;
  private readonly elementBytes: number;
  private readonly carry: Uint8Array;
  private carryLength = 0;
  /** an aligned copy of misaligned input, reused between calls */
  private scratch = new ArrayBuffer(0);
  /** Σ (x − x) over the last block: 0 when every value is finite, NaN otherwise */
  private check = 0;

  constructor(private readonly layout: FrameLayout) {
    this.elementBytes = ELEMENT_BYTES[layout.element];
    this.frameBytes = this.elementBytes * layout.channels;
    this.carry = new Uint8Array(this.frameBytes);
  }

  /** Bytes of an incomplete frame held back for the next call. */
  get pendingBytes(): number {
    return this.carryLength;
  }

  /** True when the last block returned by decode() holds a NaN or ±Inf (then see firstNonFinite). */
  get lastBlockNonFinite(): boolean {
    return this.check !== 0;
  }

  /** Decodes every complete frame in `bytes` (after any carried bytes); returns null when none completed. */
  decode(bytes: Uint8Array): SampleBlock | null {
    this.check = 0;
    let start = 0;
    let carriedFrame = 0;
    if (this.carryLength > 0) {
      const need = this.frameBytes - this.carryLength;
      const take = Math.min(need, bytes.length);
      this.carry.set(bytes.subarray(0, take), this.carryLength);
      this.carryLength += take;
      start = take;
      if (this.carryLength < this.frameBytes) return null;
      carriedFrame = 1;
    }
    const bulkFrames = Math.floor((bytes.length - start) / this.frameBytes);
    const total = carriedFrame + bulkFrames;
    const channels: Float64Array[] = [];
    for (let c = 0; c < this.layout.channels; c++) channels.push(new Float64Array(total));
    if (carriedFrame) {
      this.decodeWithView(this.carry, 0, 1, channels, 0);
      this.carryLength = 0;
    }
    if (bulkFrames > 0) this.decodeBulk(bytes, start, bulkFrames, channels, carriedFrame);
    const used = start + bulkFrames * this.frameBytes;
    const rest = bytes.length - used;
    if (rest > 0) {
      this.carry.set(bytes.subarray(used), 0);
      this.carryLength = rest;
    }
    return total > 0 ? { channels } : null;
  }

  private decodeBulk(bytes: Uint8Array, start: number, frames: number, out: Float64Array[], at: number): void {
    const { element, littleEndian } = this.layout;
    if (element === 'int24' || littleEndian !== HOST_LITTLE_ENDIAN) {
      this.decodeWithView(bytes, start, frames, out, at);
      return;
    }
    // Host byte order: view the bytes as a typed array (copy first when misaligned).
    const byteLength = frames * this.frameBytes;
    let buffer = bytes.buffer as ArrayBuffer;
    let offset = bytes.byteOffset + start;
    if (offset % this.elementBytes !== 0) {
      if (this.scratch.byteLength < byteLength) this.scratch = new ArrayBuffer(byteLength);
      new Uint8Array(this.scratch, 0, byteLength).set(bytes.subarray(start, start + byteLength));
      buffer = this.scratch;
      offset = 0;
    }
    const count = frames * this.layout.channels;
    const view =
      element === 'float32'
        ? new Float32Array(buffer, offset, count)
        : element === 'float64'
          ? new Float64Array(buffer, offset, count)
          : element === 'int16'
            ? new Int16Array(buffer, offset, count)
            : new Int32Array(buffer, offset, count);
    // copy out, summing x − x on the way (0 for finite values, NaN once any value is NaN or ±Inf)
    let check = 0;
    const a = out[0];
    if (this.layout.channels === 1) {
      for (let i = 0; i < frames; i++) {
        const v = view[i];
        a[at + i] = v;
        check += v - v;
      }
    } else {
      const b = out[1];
      for (let i = 0, j = 0; i < frames; i++, j += 2) {
        const v = view[j];
        const w = view[j + 1];
        a[at + i] = v;
        b[at + i] = w;
        check += v - v + (w - w);
      }
    }
    this.check += check;
  }

  private decodeWithView(bytes: Uint8Array, start: number, frames: number, out: Float64Array[], at: number): void {
    const dv = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const le = this.layout.littleEndian;
    const eb = this.elementBytes;
    const nch = this.layout.channels;
    let p = start;
    for (let i = 0; i < frames; i++) {
      for (let c = 0; c < nch; c++) {
        let v: number;
        switch (this.layout.element) {
          case 'int16':
            v = dv.getInt16(p, le);
            break;
          case 'int32':
            v = dv.getInt32(p, le);
            break;
          case 'float32':
            v = dv.getFloat32(p, le);
            break;
          case 'float64':
            v = dv.getFloat64(p, le);
            break;
          default: {
            // int24: assemble the three bytes, then sign-extend from bit 23
            const b0 = bytes[p];
            const b1 = bytes[p + 1];
            const b2 = bytes[p + 2];
            const u = le ? b0 | (b1 << 8) | (b2 << 16) : b2 | (b1 << 8) | (b0 << 16);
            v = (u << 8) >> 8;
          }
        }
        out[c][at + i] = v;
        this.check += v - v;
        p += eb;
      }
    }
  }
}

/** Index of the first frame of `block` holding NaN or ±Inf in any channel, or -1 when all are finite. */
export function firstNonFinite(block: SampleBlock): number {
  // fast pass: x − x is 0 for finite x and NaN for NaN and ±Inf, and NaN survives the sum
  let check = 0;
  for (const ch of block.channels) {
    for (let i = 0; i < ch.length; i++) check += ch[i] - ch[i];
  }
  if (check === 0) return -1;
  const n = block.channels[0].length;
  for (let i = 0; i < n; i++) {
    for (const ch of block.channels) if (!Number.isFinite(ch[i])) return i;
  }
  return -1;
}
