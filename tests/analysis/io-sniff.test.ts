import { describe, expect, it } from 'vitest';
import { chooseFormat, looksLikeText, sniffFormat } from '../../analysis/io/sniff';
import { inferKind, preview } from '../../analysis/io/preview';
import { encodeFrames, encodeNpy, encodeWav, textBytes } from './io-encoders';

const npy = encodeNpy('<c8', [3], encodeFrames([[1, 2], [3, 4], [5, 6]], 'f4', true));
const wav = encodeWav(encodeFrames([[1], [2], [3]], 'i2', true), { formatTag: 1, bits: 16, channels: 1, rate: 44100 });
const raw = encodeFrames([[0.1, -0.2], [0.3, 0.4]], 'f4', true);

describe('sniffFormat', () => {
  it('sniffFormat finds npy from the magic string, whatever the name says', () => {
    expect(sniffFormat(npy, 'capture.csv')).toEqual({ format: 'npy', from: 'magic' });
  });
  it('sniffFormat finds wav from RIFF….WAVE', () => {
    expect(sniffFormat(wav, 'x.bin')).toEqual({ format: 'wav', from: 'magic' });
  });
  it('sniffFormat finds csv from text-looking bytes', () => {
    expect(sniffFormat(textBytes('0.1,0.2\n'), 'x.bin')).toEqual({ format: 'csv', from: 'text' });
  });
  it('sniffFormat falls back to the extension for binary bytes', () => {
    expect(sniffFormat(raw, 'ecl.f32')).toEqual({ format: 'raw', from: 'extension' });
    expect(sniffFormat(raw, 'ecl.unknown')).toBeUndefined();
  });
  it('looksLikeText refuses NUL bytes and accepts UTF-8 header names', () => {
    expect(looksLikeText(Uint8Array.from([0x31, 0x00, 0x32]))).toBe(false);
    expect(looksLikeText(textBytes('φ (rad)\n0.5\n'))).toBe(true);
  });
  it('chooseFormat lets an explicit format win over the magic bytes', () => {
    expect(chooseFormat(npy, 'raw')).toEqual({ format: 'raw', from: 'option' });
  });
  it('chooseFormat refuses an empty file and an unrecognisable one', () => {
    expect(() => chooseFormat(new Uint8Array(0))).toThrow(/empty/);
    expect(() => chooseFormat(raw, undefined, 'mystery')).toThrow(/cannot tell the file format/);
  });
});

describe('preview', () => {
  it('preview of a CSV with a time column shows the rows, the rate, the kind and needs nothing', () => {
    const p = preview(textBytes('time,phase\n0,0.1\n0.5,0.2\n1.0,0.4\n'), { complete: true });
    expect(p).toMatchObject({ format: 'csv', formatFrom: 'text', channelCount: 1, sampleRateHz: 2, kindGuess: 'phase', needs: [] });
    expect(p.rows).toEqual([[0.1], [0.2], [0.4]]);
    expect(p.textLines?.[0]).toBe('time,phase');
  });
  it('preview of a CSV prefix cut mid-line reads only the whole lines', () => {
    const p = preview(textBytes('1\n2\n3\n4.12'), { maxRows: 10 });
    expect(p.rows).toEqual([[1], [2], [3]]);
    expect(p.needs).toEqual(['sampleRateHz', 'kind']);
  });
  it('preview of a complex npy shows the header fields, IQ and that the sample rate is missing', () => {
    const p = preview(npy, { fileName: 'heron.npy', totalBytes: npy.length });
    expect(p).toMatchObject({ format: 'npy', channelCount: 2, kindGuess: 'iq', declaredSamples: 3, estimatedSamples: 3, needs: ['sampleRateHz'] });
    expect(p.fields.descr).toBe('<c8');
    expect(p.rows).toEqual([[1, 2], [3, 4], [5, 6]]);
  });
  it('preview of a mono WAV shows its rate and asks for the kind', () => {
    const p = preview(wav);
    expect(p).toMatchObject({ format: 'wav', channelCount: 1, sampleRateHz: 44100, needs: ['kind'] });
    expect(p.rows).toEqual([[1], [2], [3]]);
  });
  it('preview of a raw file without a dtype asks for dtype, sample rate and kind', () => {
    expect(preview(raw, { fileName: 'x.bin' })).toMatchObject({ format: 'raw', rows: [], needs: ['dtype', 'sampleRateHz', 'kind'] });
  });
  it('preview of a raw file with dtype and channels decodes the first frames and estimates the count', () => {
    const p = preview(raw, { fileName: 'x.bin', dtype: 'float32', channels: 2, totalBytes: 8000 });
    expect(p.rows).toEqual([[Math.fround(0.1), Math.fround(-0.2)], [Math.fround(0.3), Math.fround(0.4)]]);
    expect(p.estimatedSamples).toBe(1000);
    expect(p.kindGuess).toBe('iq');
  });
  it('preview of a too-short npy prefix says the header is incomplete', () => {
    expect(() => preview(npy.subarray(0, 40))).toThrow(/do not hold the whole npy header/);
  });
  it('inferKind returns undefined for one unnamed channel', () => {
    expect(inferKind({ format: 'raw', channelCount: 1, details: {} })).toBeUndefined();
  });
});
