import { describe, expect, it } from 'vitest';
import { WavReader } from '../../analysis/io/wav';
import { type Chunking, encodeFrames, encodeWav, readAll, seeded, type TestElement, textBytes } from './io-encoders';

const chunkings: Chunking[] = ['whole', 'bytewise', { randomSeed: 5, maxChunk: 17 }];

function frames(n: number, channels: number, el: TestElement, seed: number): number[][] {
  const r = seeded(seed);
  const full: Record<TestElement, number> = { i2: 32767, i3: 8388607, i4: 2147483647, f4: 1, f8: 1 };
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: channels }, () => {
      if (i === 0) return el.startsWith('i') ? -full[el] - 1 : -1; // the most negative value first
      const u = r() * 2 - 1;
      return el.startsWith('i') ? Math.round(u * full[el]) : el === 'f4' ? Math.fround(u) : u;
    }),
  );
}

describe('WavReader round trips', () => {
  const encodings: [string, number, TestElement, number][] = [
    ['PCM 16-bit', 1, 'i2', 16],
    ['PCM 24-bit', 1, 'i3', 24],
    ['PCM 32-bit', 1, 'i4', 32],
    ['IEEE float 32-bit', 3, 'f4', 32],
    ['IEEE float 64-bit', 3, 'f8', 64],
  ];
  for (const [name, tag, el, bits] of encodings) {
    for (const channels of [1, 2]) {
      for (const extensible of [false, true]) {
        it(`new WavReader() reads ${name}, ${channels} channel(s)${extensible ? ', WAVE_FORMAT_EXTENSIBLE' : ''} back exactly, in any chunking`, () => {
          const f = frames(19, channels, el, bits + channels);
          const file = encodeWav(encodeFrames(f, el, true), {
            formatTag: extensible ? 0xfffe : tag,
            subFormat: tag,
            bits,
            channels,
            rate: 48000,
            before: [{ id: 'JUNK', bytes: new Uint8Array(7) }],
            after: [{ id: 'LIST', bytes: textBytes('INFOISFT') }],
          });
          for (const chunking of chunkings) {
            const reader = new WavReader();
            const got = readAll(reader, file, chunking);
            expect(reader.info?.sampleRateHz).toBe(48000);
            expect(reader.info?.channelCount).toBe(channels);
            expect(reader.info?.declaredSamples).toBe(19);
            for (let c = 0; c < channels; c++) expect(got[c]).toEqual(f.map((x) => x[c]));
          }
        });
      }
    }
  }

  it('new WavReader() skips unknown chunks of odd size (with their pad byte) before and after fmt', () => {
    const file = encodeWav(encodeFrames([[1], [2], [3]], 'i2', true), {
      formatTag: 1,
      bits: 16,
      channels: 1,
      rate: 8000,
      before: [{ id: 'bext', bytes: new Uint8Array(5) }],
      after: [{ id: 'cue ', bytes: new Uint8Array(3) }],
    });
    expect(readAll(new WavReader(), file, 'bytewise')).toEqual([[1, 2, 3]]);
  });

  it('new WavReader() reads 00 80 in 16-bit PCM as -32768 (integers keep their counts)', () => {
    const file = encodeWav(Uint8Array.from([0x00, 0x80]), { formatTag: 1, bits: 16, channels: 1, rate: 8000 });
    expect(readAll(new WavReader(), file)).toEqual([[-32768]]);
  });
});

describe('WavReader rejects', () => {
  const data = encodeFrames([[1], [2], [3], [4]], 'i2', true);
  const base = { formatTag: 1, bits: 16, channels: 1, rate: 8000 };

  it('a data chunk larger than the file, naming the chunk and its byte offset', () => {
    const file = encodeWav(data, { ...base, dataSizeField: 80000 });
    expect(() => readAll(new WavReader(), file, 'bytewise')).toThrow(
      /chunk 'data' claims 80000 bytes, the file holds 8 after its header \(chunk 'data' at byte offset 36\)/,
    );
  });
  it('a data chunk larger than the file, at once when the size is known', () => {
    const file = encodeWav(data, { ...base, dataSizeField: 80000 });
    const reader = new WavReader({ totalBytes: file.length });
    expect(() => reader.push(file.subarray(0, 44))).toThrow(/chunk 'data' at byte offset 36/);
  });
  it('an unknown chunk larger than the file, naming it', () => {
    const file = encodeWav(data, { ...base, after: [{ id: 'LIST', bytes: new Uint8Array(4) }] });
    new DataView(file.buffer).setUint32(file.length - 8, 1000, true);
    expect(() => readAll(new WavReader(), file)).toThrow(/chunk 'LIST' claims 1000 bytes.*chunk 'LIST' at byte offset 52/);
  });
  it('a RIFF size beyond the file', () => {
    const file = encodeWav(data, { ...base, riffSizeField: 5000 });
    expect(() => readAll(new WavReader(), file)).toThrow(/chunk 'RIFF' at byte offset 0/);
  });
  it('8-bit PCM, naming the fmt chunk', () => {
    const file = encodeWav(new Uint8Array(4), { ...base, bits: 8 });
    expect(() => readAll(new WavReader(), file)).toThrow(/unsupported WAV encoding: format 1 with 8 bits.*chunk 'fmt ' at byte offset 12/);
  });
  it('three channels', () => {
    const file = encodeWav(new Uint8Array(12), { ...base, channels: 3 });
    expect(() => readAll(new WavReader(), file)).toThrow(/3 channels/);
  });
  it('an extensible sub-format GUID that is not PCM or float', () => {
    const file = encodeWav(data, { ...base, formatTag: 0xfffe, subFormat: 1, badGuid: true });
    expect(() => readAll(new WavReader(), file)).toThrow(/sub-format GUID/);
  });
  it('a data chunk that is not a whole number of frames', () => {
    const file = encodeWav(new Uint8Array(7), { ...base, channels: 2 });
    expect(() => readAll(new WavReader(), file)).toThrow(/not a whole number of 4-byte frames.*chunk 'data'/);
  });
  it('a data chunk before the fmt chunk', () => {
    const file = encodeWav(data, { ...base, before: [{ id: 'data', bytes: data }] });
    expect(() => readAll(new WavReader(), file)).toThrow(/before the 'fmt ' chunk.*byte offset 12/);
  });
  it('no data chunk', () => {
    const file = encodeWav(data, base);
    file.set(textBytes('dat_'), 36);
    expect(() => readAll(new WavReader(), file)).toThrow(/no 'data' chunk/);
  });
  it('RF64 files', () => {
    const file = encodeWav(data, base);
    file.set(textBytes('RF64'), 0);
    expect(() => readAll(new WavReader(), file)).toThrow(/RF64/);
  });
  it('a file that is not RIFF/WAVE', () => {
    const file = encodeWav(data, base);
    file.set(textBytes('AVI '), 8);
    expect(() => readAll(new WavReader(), file, 'bytewise')).toThrow(/form type is 'AVI '.*byte offset 8/);
  });
  it('an empty file', () => {
    expect(() => readAll(new WavReader(), new Uint8Array(0))).toThrow(/empty/);
  });
  it('an Inf in float data, naming the byte offset of its frame', () => {
    const file = encodeWav(encodeFrames([[0.5, 1], [Infinity, 0]], 'f4', true), { formatTag: 3, bits: 32, channels: 2, rate: 1000 });
    expect(() => readAll(new WavReader(), file)).toThrow(/NaN or Inf value in frame 1 \(byte offset 54\)/);
  });
});
