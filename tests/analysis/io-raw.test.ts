import { describe, expect, it } from 'vitest';
import { RawReader } from '../../analysis/io/raw';
import { AnalysisInputError } from '../../analysis/errors';
import type { RawDtype } from '../../analysis/types';
import { type Chunking, type TestElement, encodeFrames, readAll, seeded } from './io-encoders';

const EL: Record<RawDtype, TestElement> = { int16: 'i2', int32: 'i4', float32: 'f4', float64: 'f8' };

function values(dtype: RawDtype, n: number, seed: number): number[] {
  const r = seeded(seed);
  const ext: Record<RawDtype, number[]> = {
    int16: [-32768, 32767, 0, -1],
    int32: [-2147483648, 2147483647, 0, -1],
    float32: [Math.fround(1e-30), Math.fround(-3.4e38), 0, -0.5],
    float64: [Number.MIN_VALUE, -1.7976931348623157e308, 0, 1 / 3],
  };
  const out = [...ext[dtype]];
  while (out.length < n) {
    const u = r() * 2 - 1;
    if (dtype === 'int16') out.push(Math.round(u * 32767));
    else if (dtype === 'int32') out.push(Math.round(u * 2147483647));
    else if (dtype === 'float32') out.push(Math.fround(u * 1e3));
    else out.push(u * 1e-3);
  }
  return out;
}

const chunkings: Chunking[] = ['whole', 'bytewise', { randomSeed: 7, maxChunk: 13 }];

describe('RawReader round trips', () => {
  for (const dtype of ['int16', 'int32', 'float32', 'float64'] as RawDtype[]) {
    for (const byteOrder of ['little', 'big'] as const) {
      for (const channels of [1, 2] as const) {
        it(`new RawReader({ dtype: '${dtype}', channels: ${channels}, byteOrder: '${byteOrder}' }) reads back what was written, in any chunking`, () => {
          const v = values(dtype, 2 * 37, dtype.length + channels);
          const frames = channels === 1 ? v.map((x) => [x]) : Array.from({ length: 37 }, (_, i) => [v[2 * i], v[2 * i + 1]]);
          const bytes = encodeFrames(frames, EL[dtype], byteOrder === 'little');
          for (const chunking of chunkings) {
            const reader = new RawReader({ dtype, channels, byteOrder });
            const got = readAll(reader, bytes, chunking);
            expect(got.length).toBe(channels);
            for (let c = 0; c < channels; c++) expect(got[c]).toEqual(frames.map((f) => f[c]));
            expect(reader.samplesOut).toBe(frames.length);
            expect(reader.info.channelCount).toBe(channels);
          }
        });
      }
    }
  }

  it('new RawReader int16 2-channel little endian decodes the documented 8-byte example', () => {
    const reader = new RawReader({ dtype: 'int16', channels: 2, byteOrder: 'little' });
    const got = readAll(reader, Uint8Array.from([0x01, 0x00, 0xff, 0x7f, 0x00, 0x80, 0xff, 0xff]));
    expect(got).toEqual([
      [1, -32768],
      [32767, -1],
    ]);
  });

  it('new RawReader float32 big endian reads 3F 80 00 00 as 1', () => {
    const got = readAll(new RawReader({ dtype: 'float32', channels: 1, byteOrder: 'big' }), Uint8Array.from([0x3f, 0x80, 0, 0]));
    expect(got).toEqual([[1]]);
  });
});

describe('RawReader rejects', () => {
  it('a trailing partial frame, naming its byte offset', () => {
    const bytes = encodeFrames([[1, 2], [3, 4], [5, 6]], 'f4', true);
    const reader = new RawReader({ dtype: 'float32', channels: 2, byteOrder: 'little' });
    expect(() => readAll(reader, bytes.subarray(0, 21), 'bytewise')).toThrow(/partial frame: 5 byte\(s\) left over.*\(byte offset 16\)/);
  });

  it('an empty file', () => {
    expect(() => readAll(new RawReader({ dtype: 'int16', channels: 1, byteOrder: 'little' }), new Uint8Array(0))).toThrow(
      AnalysisInputError,
    );
  });

  it('a NaN value, naming the byte offset of its frame', () => {
    const bytes = encodeFrames([[1, 2], [3, NaN], [5, 6]], 'f8', false);
    expect(() => readAll(new RawReader({ dtype: 'float64', channels: 2, byteOrder: 'big' }), bytes)).toThrow(
      /NaN or Inf value in frame 1 \(byte offset 16\)/,
    );
  });

  it('an Inf value split across chunks', () => {
    const bytes = encodeFrames([[1], [2], [Infinity]], 'f4', true);
    expect(() => readAll(new RawReader({ dtype: 'float32', channels: 1, byteOrder: 'little' }), bytes, 'bytewise')).toThrow(
      /frame 2 \(byte offset 8\)/,
    );
  });
});
