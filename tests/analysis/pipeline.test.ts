import { describe, expect, it } from 'vitest';
import { type AnalyzeOptions, analyzeCapture, defaultSegment, resolveAnalyzeOptions } from '../../analysis/pipeline';
import { AnalysisInputError } from '../../analysis/errors';
import { synthesize } from '../../analysis/synth/generator';
import { encodeFrames, encodeNpy, seeded, textBytes } from './io-encoders';

/**
 * White frequency noise of one-sided level h0 (Hz²/Hz) sampled at fs: the phase steps are
 * independent Gaussians of variance 2π²·h0/fs (ν = fs/(2π)·Δφ has variance h0·fs/2, METHODS 2.4:
 * the differenced series is exactly white with level h0 up to Nyquist). Its line is a Lorentzian of
 * FWHM π·h0 (Elliott, Roy, Smith, Phys. Rev. A 26, 12 (1982)).
 */
function whiteFmPhase(n: number, fs: number, h0: number, seed: number): Float64Array {
  const rnd = seeded(seed);
  const sigma = Math.sqrt((2 * Math.PI * Math.PI * h0) / fs);
  const phi = new Float64Array(n);
  let p = 0;
  for (let i = 0; i < n; i += 2) {
    // Box–Muller: two Gaussians from two uniforms
    const r = Math.sqrt(-2 * Math.log(1 - rnd()));
    const a = 2 * Math.PI * rnd();
    p += sigma * r * Math.cos(a);
    phi[i] = p;
    if (i + 1 < n) {
      p += sigma * r * Math.sin(a);
      phi[i + 1] = p;
    }
  }
  return phi;
}

const FS = 1e6;
const H0 = 1e4;
const N = 1 << 20;
const PHI = whiteFmPhase(N, FS, H0, 2026);

function iqNpy(phi: Float64Array): Uint8Array {
  const frames: number[][] = Array.from(phi, (p) => [Math.cos(p), Math.sin(p)]);
  return encodeNpy('<f8', [phi.length, 2], encodeFrames(frames, 'f8', true));
}

async function* chunked(bytes: Uint8Array, seed: number, maxChunk: number): AsyncGenerator<Uint8Array> {
  const rnd = seeded(seed);
  for (let p = 0; p < bytes.length; ) {
    const n = 1 + Math.floor(rnd() * maxChunk);
    yield bytes.subarray(p, p + n);
    p += n;
  }
}

const IQ = iqNpy(PHI);

describe('analyzeCapture on white frequency noise h0 = 1e4 Hz²/Hz (IQ .npy, fs = 1 MHz, 2^20 samples)', () => {
  it('analyzeCapture gives the intrinsic linewidth π·h0 = 31415.9 Hz within 5 % and the floor h0 within 5 %', async () => {
    const { report } = await analyzeCapture({ chunks: chunked(IQ, 1, 1 << 20), totalBytes: IQ.length }, { sampleRateHz: FS });
    expect(report.input).toMatchObject({ kind: 'iq', format: 'npy', formatFrom: 'magic', channels: 2, samples: N, sampleRateHz: FS });
    expect(report.input.durationS).toBeCloseTo(N / FS, 12);
    expect(Math.abs(report.intrinsicLinewidthHz / (Math.PI * H0) - 1)).toBeLessThan(0.05);
    expect(Math.abs(report.whiteFloor.valueHz2PerHz / H0 - 1)).toBeLessThan(0.05);
    // the β-line and the lineshape FWHM of a white floor also approach π·h0 (METHODS 3.3, case 7)
    expect(Math.abs(report.betaLine.linewidthHz / (Math.PI * H0) - 1)).toBeLessThan(0.05);
    expect(Math.abs(report.lineshape.fwhmHz! / (Math.PI * H0) - 1)).toBeLessThan(0.05);
    expect(report.spectrum).toBeUndefined();
    // nothing to warn about on clean white noise; the lowest point (within 2/T0) is stretched to 1/T0, said as a note
    expect(report.warnings).toEqual([]);
    expect(report.notes.join(' ')).toMatch(/taken flat at that point's level .* down to 1\/T0/);
    expect(report.spurs).toEqual([]);
    expect(report.bumps).toEqual([]);
    // the white-only model: a₋₁ and a₋₂ are not supported by the data (Schwarz criterion, model-fit.ts)
    expect(Math.abs(report.noiseModel.whiteHz2PerHz / H0 - 1)).toBeLessThan(0.02);
    expect(report.noiseModel.flickerHz2).toBe(0);
    expect(report.noiseModel.randomWalkHz3).toBe(0);
  });

  it('analyzeCapture reports the Welch settings: default segment 65536 (≤ N/8, capped), K = ⌊(n − L)/D⌋ + 1 over n = N − 1 frequency samples', async () => {
    const { report, spectrum } = await analyzeCapture({ chunks: [IQ] }, { sampleRateHz: FS, overlap: 0.5 });
    const L = 65536; // N/8 = 131072, capped at 65536
    // the full-rate stage of the cascade is that Welch estimate
    expect(spectrum.averages[spectrum.stage.indexOf(0)]).toBe(report.settings.averages);
    expect(report.settings).toMatchObject({ window: 'hann', segment: L, overlap: 0.5 });
    expect(report.settings.averages).toBe(Math.floor((N - 1 - L) / (L / 2)) + 1);
    // ENBW of the periodic Hann window: 1.5 bins (METHODS 1.2)
    expect(report.settings.enbwHz).toBeCloseTo((1.5 * FS) / L, 9);
  });

  it('analyzeCapture does not depend on how the bytes are chunked', async () => {
    const opts: AnalyzeOptions = { sampleRateHz: FS, segment: 4096 };
    const a = await analyzeCapture({ chunks: chunked(IQ, 5, 4 << 20) }, opts);
    const b = await analyzeCapture({ chunks: chunked(IQ, 6, 777) }, opts);
    // the carrier figures are running sums over blocks: equal to rounding
    expect(b.report.carrier.offsetHz).toBeCloseTo(a.report.carrier.offsetHz, 9);
    expect(b.report.carrier.driftHzPerS).toBeCloseTo(a.report.carrier.driftHzPerS, 6);
    expect({ ...b.report, carrier: null }).toEqual({ ...a.report, carrier: null });
  });

  it('analyzeCapture reads the same record as a phase CSV with a time column: kind and sample rate from the file', async () => {
    const n = 1 << 16;
    const lines = ['time (s),phase (rad)'];
    for (let i = 0; i < n; i++) lines.push(`${(i / FS).toExponential(12)},${PHI[i]}`);
    const csv = textBytes(lines.join('\n') + '\n');
    const { report } = await analyzeCapture({ chunks: chunked(csv, 2, 65536), totalBytes: csv.length }, { segment: 2048 });
    expect(report.input).toMatchObject({ kind: 'phase', format: 'csv', formatFrom: 'text', samples: n });
    expect(report.input.sampleRateHz / FS).toBeCloseTo(1, 9);
    expect(Math.abs(report.intrinsicLinewidthHz / (Math.PI * H0) - 1)).toBeLessThan(0.1);
    // the same samples as IQ give the same frequency series: the phase kind and the IQ kind agree
    const iq = iqNpy(PHI.subarray(0, n));
    const fromIq = await analyzeCapture({ chunks: [iq] }, { sampleRateHz: FS, segment: 2048 });
    expect(report.whiteFloor.valueHz2PerHz / fromIq.report.whiteFloor.valueHz2PerHz).toBeCloseTo(1, 6);
  });

  it('analyzeCapture with series puts the stitched and the log-binned S_ν in the report', async () => {
    const { report } = await analyzeCapture({ chunks: [IQ] }, { sampleRateHz: FS, segment: 8192, series: true });
    const s = report.spectrum!;
    expect(s.frequencyHz.length).toBe(s.frequencyNoiseHz2PerHz.length);
    expect(s.frequencyHz.length).toBeGreaterThan(8192 / 2 - 4);
    // every bin above 1 kHz holds white noise h0: their mean is h0 within 2 %
    const hi = s.frequencyNoiseHz2PerHz.filter((_, i) => s.frequencyHz[i] > 1e3);
    expect(Math.abs(hi.reduce((a, b) => a + b, 0) / hi.length / H0 - 1)).toBeLessThan(0.02);
    expect(report.logSpectrum!.frequencyHz.length).toBeLessThan(300);
  });

  it('analyzeCapture reports progress: reading, then spectrum, then figures, ending at 1', async () => {
    const seen: [number, string][] = [];
    await analyzeCapture({ chunks: chunked(IQ, 3, 1 << 18), totalBytes: IQ.length }, { sampleRateHz: FS, segment: 4096 }, (f, s) =>
      seen.push([f, s]),
    );
    const stages = [...new Set(seen.map((x) => x[1]))];
    expect(stages).toEqual(['reading', 'spectrum', 'figures']);
    for (let i = 1; i < seen.length; i++) expect(seen[i][0]).toBeGreaterThanOrEqual(seen[i - 1][0]);
    expect(seen[seen.length - 1]).toEqual([1, 'figures']);
    expect(seen.filter((x) => x[1] === 'reading').length).toBeGreaterThan(2);
  });
});

describe('analyzeCapture on a DFB-like record: white 1e3 + flicker 1e7/f and a 50 Hz mains line of 20 kHz peak deviation (IQ, fs = 500 kHz, 2^19 samples)', () => {
  // known parameters of the synthetic record (analysis/synth/generator.ts); the checks are the analytic
  // values: intrinsic linewidth π·h0 (METHODS 3.2), the β-line area h0(f_x − 1/T0) + h₋₁ ln(f_x T0)
  // (METHODS 3.3, closed form for white + flicker) plus the line's power Δ²/2 (an FM tone ν = Δ sin 2πf_m t)
  const fs = 5e5;
  const n = 1 << 19;
  const h0 = 1e3;
  const h1 = 1e7;
  const dev = 2e4;
  const C = (8 * Math.LN2) / (Math.PI * Math.PI);
  it.each([1, 2])('seed %i: intrinsic π·h0 within 5 %, the model within 1.5 dB at its low end, one spur at 50 Hz carrying Δ²/2, β area within 10 %, no warnings', async (seed) => {
    const [i, q] = synthesize(
      { sampleRateHz: fs, output: 'iq', whiteHz2PerHz: h0, flickerHz2: h1, spurs: [{ frequencyHz: 50, peakDeviationHz: dev }], seed },
      n,
    ).channels;
    const bytes = encodeNpy('<f8', [n, 2], encodeFrames(Array.from(i, (v, k) => [v, q[k]]), 'f8', true));
    const { report, spectrum, logSpectrum } = await analyzeCapture({ chunks: [bytes] }, { sampleRateHz: fs });
    expect(Math.abs(report.intrinsicLinewidthHz / (Math.PI * h0) - 1)).toBeLessThan(0.05);
    const m = report.noiseModel;
    expect(Math.abs(m.whiteHz2PerHz / h0 - 1)).toBeLessThan(0.05);
    expect(Math.abs(m.flickerHz2 / h1 - 1)).toBeLessThan(0.1);
    // the line must not pull a random-walk term up: the model stays on the data at the bottom of its band
    const low = logSpectrum.reliableFromHz;
    const atLow = m.whiteHz2PerHz + m.flickerHz2 / low + m.randomWalkHz3 / (low * low);
    expect(Math.abs(10 * Math.log10(atLow / (h0 + h1 / low)))).toBeLessThan(1.5);
    // one narrow line, within a bin of 50 Hz, whose power gives back the peak deviation (√(2P) = Δ) within 10 %
    expect(report.spurs).toHaveLength(1);
    const bin = spectrum.resolutionHz[spectrum.frequencyHz.findIndex((f) => f >= 50)];
    expect(Math.abs(report.spurs[0].frequencyHz - 50)).toBeLessThanOrEqual(bin);
    expect(Math.abs(Math.sqrt(2 * report.spurs[0].powerHz2) / dev - 1)).toBeLessThan(0.1);
    expect(report.bumps).toEqual([]);
    const T0 = n / fs;
    const fx = (h0 + Math.sqrt(h0 * h0 + 4 * C * h1)) / (2 * C);
    const area = h0 * (fx - 1 / T0) + h1 * Math.log(fx * T0) + (dev * dev) / 2;
    // the few-average points of the lowest octaves scatter by ±40 % each: 10 % on the area
    expect(Math.abs(report.betaLine.areaHz2 / area - 1)).toBeLessThan(0.1);
    expect(report.warnings).toEqual([]);
  });
});

describe('analyzeCapture on a fibre-laser-like beat note with a relaxation-oscillation bump (8 kHz, 200 Hz wide, 3e3 Hz²/Hz; fs = 192 kHz, 2^18 samples)', () => {
  it.each([1, 2])('seed %i: one bump centred within 1 % of 8 kHz, width within 25 % of 200 Hz, no spurs', async (seed) => {
    const fs = 192000;
    const n = 1 << 18;
    const [v] = synthesize(
      {
        sampleRateHz: fs,
        output: 'beat',
        whiteHz2PerHz: 10,
        flickerHz2: 1e4,
        bumps: [{ centerHz: 8000, widthHz: 200, peakHz2PerHz: 3e3 }],
        intermediateFrequencyHz: 48000,
        seed,
      },
      n,
    ).channels;
    const bytes = encodeNpy('<f8', [n], encodeFrames(Array.from(v, (x) => [x]), 'f8', true));
    const { report } = await analyzeCapture({ chunks: [bytes] }, { sampleRateHz: fs, kind: 'beat' });
    expect(report.spurs).toEqual([]);
    expect(report.bumps).toHaveLength(1);
    expect(Math.abs(report.bumps[0].centerHz / 8000 - 1)).toBeLessThan(0.01);
    // the width is read at half the smoothed excess of a K = 14 estimate (±27 % per bin): 25 %
    expect(Math.abs(report.bumps[0].widthHz / 200 - 1)).toBeLessThan(0.25);
    // the resonance peaks at 3e3 over a background of ≈ 14 Hz²/Hz: about 23 dB
    expect(Math.abs(report.bumps[0].heightDb - 10 * Math.log10(3e3 / (10 + 1e4 / 8000)))).toBeLessThan(2);
  });
});

describe('analyzeCapture on a white-FM beat note (h0 = 100 Hz²/Hz, IF 48 kHz, fs = 192 kHz, 2^17 samples)', () => {
  it('searches the floor up to the trusted top B/2 (below fs/10 here), not B/10: the band reaches past 10 kHz; π·h0 within 5 %', async () => {
    const fs = 192000;
    const n = 1 << 17;
    const [v] = synthesize({ sampleRateHz: fs, output: 'beat', whiteHz2PerHz: 100, intermediateFrequencyHz: 48000, seed: 3 }, n).channels;
    const bytes = encodeNpy('<f8', [n], encodeFrames(Array.from(v, (x) => [x]), 'f8', true));
    const { report, frequencyStage } = await analyzeCapture({ chunks: [bytes] }, { sampleRateHz: fs, kind: 'beat' });
    const trustedTop = frequencyStage.bandwidthHz! / 2; // METHODS 2.2
    expect(report.whiteFloor.bandHz[1]).toBeGreaterThan(10e3);
    expect(report.whiteFloor.bandHz[1]).toBeLessThanOrEqual(Math.min(trustedTop, fs / 10));
    expect(Math.abs(report.intrinsicLinewidthHz / (Math.PI * 100) - 1)).toBeLessThan(0.05);
    expect(report.warnings).toEqual([]);
  });

  it('reports the trusted band up to B/2 and, with series, shows S_ν only inside it (METHODS 2.2: trust S_ν up to about B/2)', async () => {
    const fs = 192000;
    const n = 1 << 17;
    const [v] = synthesize({ sampleRateHz: fs, output: 'beat', whiteHz2PerHz: 100, intermediateFrequencyHz: 48000, seed: 4 }, n).channels;
    const bytes = encodeNpy('<f8', [n], encodeFrames(Array.from(v, (x) => [x]), 'f8', true));
    const { report, frequencyStage, spectrum } = await analyzeCapture({ chunks: [bytes] }, { sampleRateHz: fs, kind: 'beat', series: true });
    const trustedTop = frequencyStage.bandwidthHz! / 2;
    expect(report.trustedBandHz[1]).toBe(trustedTop);
    const shown = report.spectrum!.frequencyHz;
    expect(shown[shown.length - 1]).toBeLessThanOrEqual(trustedTop);
    // the bins above B/2 exist in the engine's spectrum but are not shown
    expect(spectrum.frequencyHz[spectrum.frequencyHz.length - 1]).toBeGreaterThan(trustedTop);
    expect(shown.length).toBe(spectrum.frequencyHz.filter((f) => f <= trustedTop).length);
  });
});

describe('analyzeCapture rejects', () => {
  const small = iqNpy(PHI.subarray(0, 5000));
  const run = (bytes: Uint8Array, o: AnalyzeOptions) => analyzeCapture({ chunks: [bytes], totalBytes: bytes.length }, o);

  it('a missing sample rate (npy states none)', async () => {
    await expect(run(small, {})).rejects.toThrow(/sample rate is missing.*option sampleRateHz/);
  });
  it('a missing kind for one unnamed channel', async () => {
    await expect(run(textBytes('1\n2\n3\n'), { sampleRateHz: 10 })).rejects.toThrow(/kind of capture is missing/);
  });
  it("kind 'iq' for a one-channel file", async () => {
    await expect(run(textBytes('1\n2\n3\n'), { sampleRateHz: 10, kind: 'iq' })).rejects.toThrow(/needs two channels/);
  });
  it("kind 'phase' for a two-channel file", async () => {
    await expect(run(small, { sampleRateHz: FS, kind: 'phase' })).rejects.toThrow(/needs one channel/);
  });
  it('a record too short for two segments, saying how many samples a segment needs', async () => {
    await expect(run(small, { sampleRateHz: FS, segment: 4096 })).rejects.toThrow(
      /too short for two segments: 4999 frequency samples, a segment of 4096 with a hop of 2048 needs at least 6144/,
    );
  });
  it('a record too short, from the npy header before the rest of the data is read', async () => {
    async function* firstChunkOnly(): AsyncGenerator<Uint8Array> {
      yield small.subarray(0, 4096);
      throw new Error('read past the first chunk');
    }
    await expect(analyzeCapture({ chunks: firstChunkOnly() }, { sampleRateHz: FS, segment: 4096 })).rejects.toThrow(
      /too short for two segments/,
    );
  });
  it('an empty file', async () => {
    await expect(run(new Uint8Array(0), { sampleRateHz: FS })).rejects.toThrow(/the file is empty/);
  });
  it('dtype given for an npy file', async () => {
    await expect(run(small, { sampleRateHz: FS, dtype: 'float32' })).rejects.toThrow(/dtype applies to raw binary files only/);
  });
});

describe('resolveAnalyzeOptions', () => {
  it('resolveAnalyzeOptions({}) fills window hann, overlap 0.5, series false', () => {
    expect(resolveAnalyzeOptions({})).toMatchObject({ window: 'hann', overlap: 0.5, series: false, segment: undefined });
  });
  const rejected: [string, AnalyzeOptions, RegExp][] = [
    ['kind', { kind: 'field' as never }, /kind must be one of.*option kind/],
    ['format', { format: 'xls' as never }, /format must be one of/],
    ['sampleRateHz 0', { sampleRateHz: 0 }, /sample rate must be a positive number.*option sampleRateHz/],
    ['sampleRateHz -5', { sampleRateHz: -5 }, /sample rate must be a positive number/],
    ['dtype', { dtype: 'uint8' as never }, /dtype must be one of/],
    ['channels', { channels: 3 as never }, /channels must be 1 or 2/],
    ['byteOrder', { byteOrder: 'middle' as never }, /byte order/],
    ['window', { window: 'kaiser' as never }, /window must be one of/],
    ['segment 10', { segment: 10 }, /segment must be an integer.*\[64, 16777216\]/],
    ['segment 100.5', { segment: 100.5 }, /segment must be an integer/],
    ['overlap 1', { overlap: 1 }, /overlap must be a fraction in \[0, 1\)/],
    ['observationTimeS 0', { observationTimeS: 0 }, /observation time must be a positive/],
    ['floorBandHz reversed', { floorBandHz: [100, 10] }, /floor band must be \[lo, hi\]/],
    ['dtype with format wav', { format: 'wav', dtype: 'int16' }, /dtype applies to raw binary files only/],
  ];
  for (const [name, options, message] of rejected) {
    it(`resolveAnalyzeOptions rejects ${name}`, () => {
      expect(() => resolveAnalyzeOptions(options)).toThrow(AnalysisInputError);
      expect(() => resolveAnalyzeOptions(options)).toThrow(message);
    });
  }
});

describe('defaultSegment', () => {
  it('defaultSegment is the largest power of two ≤ N/8 within [256, 65536], 4096 when N is unknown', () => {
    expect(defaultSegment(undefined)).toBe(4096);
    expect(defaultSegment(1000)).toBe(256);
    expect(defaultSegment(8 * 1024)).toBe(1024);
    expect(defaultSegment(8 * 1024 - 1)).toBe(512);
    expect(defaultSegment(1e9)).toBe(65536);
  });
});
