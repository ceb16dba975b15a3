import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { NpyReader, parseNpyHeader } from '../../analysis/io/npy';
import { type Chunking, concatBytes, encodeFrames, encodeNpy, readAll, seeded, type TestElement } from './io-encoders';

const chunkings: Chunking[] = ['whole', 'bytewise', { randomSeed: 3, maxChunk: 29 }];

function sampleFrames(n: number, channels: number, el: TestElement, seed: number): number[][] {
  const r = seeded(seed);
  return Array.from({ length: n }, () =>
    Array.from({ length: channels }, () => {
      const u = r() * 2 - 1;
      return el === 'i2' ? Math.round(u * 32767) : el === 'i4' ? Math.round(u * 2 ** 31 - 1) : el === 'f4' ? Math.fround(u) : u;
    }),
  );
}

describe('NpyReader round trips', () => {
  const descrs: [string, TestElement, boolean, boolean][] = [
    ['<f4', 'f4', true, false],
    ['>f4', 'f4', false, false],
    ['<f8', 'f8', true, false],
    ['>f8', 'f8', false, false],
    ['<i2', 'i2', true, false],
    ['>i2', 'i2', false, false],
    ['<i4', 'i4', true, false],
    ['>i4', 'i4', false, false],
    ['<c8', 'f4', true, true],
    ['>c8', 'f4', false, true],
    ['<c16', 'f8', true, true],
    ['>c16', 'f8', false, true],
  ];
  for (const [descr, el, little, complex] of descrs) {
    for (const version of [1, 2, 3] as const) {
      const shapes = complex ? [1] : [1, 2];
      for (const cols of shapes) {
        const channels = complex ? 2 : cols;
        const shapeText = cols === 2 ? '(N, 2)' : '(N,)';
        it(`new NpyReader() reads descr ${descr} shape ${shapeText} version ${version}.0 back exactly, in any chunking`, () => {
          const frames = sampleFrames(21, channels, el, version * 7 + cols);
          const file = encodeNpy(descr, cols === 2 ? [21, 2] : [21], encodeFrames(frames, el, little), { version });
          for (const chunking of chunkings) {
            const reader = new NpyReader();
            const got = readAll(reader, file, chunking);
            expect(reader.info?.channelCount).toBe(channels);
            expect(reader.info?.declaredSamples).toBe(21);
            for (let c = 0; c < channels; c++) expect(got[c]).toEqual(frames.map((f) => f[c]));
          }
        });
      }
    }
  }
});

describe('NpyReader against files written by numpy (tests/fixtures/npy, make_npy_fixtures.py)', () => {
  const dir = join(__dirname, '..', 'fixtures', 'npy');
  const expected = JSON.parse(readFileSync(join(dir, 'expected.json'), 'utf8')) as Record<
    string,
    { descr: string; shape: number[]; version: string; channels: number[][] }
  >;
  for (const [name, want] of Object.entries(expected)) {
    it(`new NpyReader() reads ${name} (${want.descr}, shape (${want.shape.join(', ')}), v${want.version}) as numpy does`, () => {
      const bytes = new Uint8Array(readFileSync(join(dir, name)));
      const reader = new NpyReader({ totalBytes: bytes.length });
      const got = readAll(reader, bytes, { randomSeed: 11, maxChunk: 40 });
      expect(reader.header?.descr).toBe(want.descr);
      expect(reader.header?.version).toBe(want.version);
      expect(got).toEqual(want.channels);
    });
  }
});

describe('parseNpyHeader', () => {
  it("parseNpyHeader accepts keys in any order, double quotes, a trailing comma and a Python 2 'L' suffix", () => {
    expect(parseNpyHeader(`{"shape": (5L, 2), 'fortran_order': False, "descr": '<i4'}   \n`)).toEqual({
      version: '1.0',
      descr: '<i4',
      fortranOrder: false,
      shape: [5, 2],
    });
  });
  it('parseNpyHeader rejects an unknown key, naming it', () => {
    expect(() => parseNpyHeader("{'descr': '<f4', 'fortran_order': False, 'shape': (3,), 'extra': 1}")).toThrow(
      /unexpected key 'extra'.*header field 'extra'/,
    );
  });
  it('parseNpyHeader rejects a missing key', () => {
    expect(() => parseNpyHeader("{'descr': '<f4', 'shape': (3,)}")).toThrow(/missing key 'fortran_order'/);
  });
  it('parseNpyHeader rejects a structured descr', () => {
    expect(() => parseNpyHeader("{'descr': [('a', '<f4')], 'fortran_order': False, 'shape': (3,)}")).toThrow(
      /header field 'descr'/,
    );
  });
  it('parseNpyHeader rejects text after the closing brace', () => {
    expect(() => parseNpyHeader("{'descr': '<f4', 'fortran_order': False, 'shape': (3,)} x")).toThrow(/after the closing brace/);
  });
  it('parseNpyHeader rejects a negative shape entry', () => {
    expect(() => parseNpyHeader("{'descr': '<f4', 'fortran_order': False, 'shape': (-3,)}")).toThrow(/header field 'shape'/);
  });
});

describe('NpyReader rejects', () => {
  const good = (n = 4) => encodeNpy('<f4', [n], encodeFrames(sampleFrames(n, 1, 'f4', 1), 'f4', true));

  it('fortran_order True, naming the header field', () => {
    const file = encodeNpy('<f4', [4, 2], new Uint8Array(32), { fortran: true });
    expect(() => readAll(new NpyReader(), file)).toThrow(/Fortran-ordered.*header field 'fortran_order'/);
  });
  it('an unsupported descr, naming the header field', () => {
    const file = encodeNpy('<u2', [4], new Uint8Array(8));
    expect(() => readAll(new NpyReader(), file)).toThrow(/unsupported npy descr '<u2'.*header field 'descr'/);
  });
  it('a shape (2, N), suggesting a transpose', () => {
    const file = encodeNpy('<f4', [2, 4], new Uint8Array(32));
    expect(() => readAll(new NpyReader(), file)).toThrow(/shape \(2, 4\).*transpose.*header field 'shape'/);
  });
  it('a complex array of shape (N, 2)', () => {
    const file = encodeNpy('<c8', [4, 2], new Uint8Array(64));
    expect(() => readAll(new NpyReader(), file)).toThrow(/header field 'shape'/);
  });
  it('a header length field over 64 KiB, naming the field, before reading further', () => {
    const file = encodeNpy('<f4', [4], new Uint8Array(16), { version: 2, headerLengthField: 70000 });
    const reader = new NpyReader();
    expect(() => reader.push(file.subarray(0, 12))).toThrow(/header length field claims 70000 bytes.*header field 'header length'/);
  });
  it('a header length beyond the end of the file when the size is known', () => {
    const file = encodeNpy('<f4', [4], new Uint8Array(16), { headerLengthField: 60000 });
    expect(() => readAll(new NpyReader({ totalBytes: file.length }), file)).toThrow(/beyond the end.*header field 'header length'/);
  });
  it('a file that ends inside the header when the size is not known', () => {
    const file = encodeNpy('<f4', [4], new Uint8Array(16), { headerLengthField: 60000 });
    expect(() => readAll(new NpyReader(), file)).toThrow(/ends inside the npy header.*header field 'header length'/);
  });
  it('a shape claiming more samples than the bytes hold, at end(), with expected vs present', () => {
    const file = good(8).subarray(0, 128 + 3 * 4 + 2);
    const reader = new NpyReader();
    expect(() => reader.push(file)).not.toThrow();
    expect(() => reader.end()).toThrow(/truncated: the header's shape claims 8 samples \(32 data bytes\), the file holds 3 samples \(14 data bytes\).*header field 'shape'/);
  });
  it('a shape claiming more samples than the file holds, early when the size is known', () => {
    const file = encodeNpy('<f8', [1e15], new Uint8Array(16));
    expect(() => new NpyReader({ totalBytes: file.length }).push(file)).toThrow(/claims 1000000000000000 samples/);
  });
  it('never allocates from a huge shape claim (reads the present bytes, then reports the truncation)', () => {
    const file = encodeNpy('<f8', [2 ** 40], new Uint8Array(new Float64Array([1, 2]).buffer));
    const reader = new NpyReader();
    const blocks = reader.push(file);
    expect(blocks[0].channels[0]).toEqual(new Float64Array([1, 2]));
    expect(() => reader.end()).toThrow(/truncated/);
  });
  it('bytes after the data the shape declares, naming the byte offset', () => {
    const file = concatBytes(good(4), new Uint8Array(3));
    expect(() => readAll(new NpyReader(), file)).toThrow(/more bytes than the header's shape declares.*byte offset 144/);
  });
  it('a wrong magic string', () => {
    const file = good();
    file[3] = 0x41;
    expect(() => readAll(new NpyReader(), file, 'bytewise')).toThrow(/magic.*byte offset 3/);
  });
  it('an unsupported version, naming the version field', () => {
    const file = good();
    file[6] = 4;
    expect(() => readAll(new NpyReader(), file)).toThrow(/version 4\.0.*header field 'version'/);
  });
  it('an empty file', () => {
    expect(() => readAll(new NpyReader(), new Uint8Array(0))).toThrow(/empty/);
  });
  it('a NaN value, naming its byte offset', () => {
    const file = encodeNpy('<f8', [3], encodeFrames([[1], [NaN], [2]], 'f8', true));
    expect(() => readAll(new NpyReader(), file)).toThrow(/NaN or Inf value in sample 1 \(byte offset 136\)/);
  });
});
