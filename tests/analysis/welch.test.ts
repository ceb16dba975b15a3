import { describe, expect, it } from 'vitest';
import { AnalysisInputError } from '../../analysis/errors';
import { resolveWelchOptions } from '../../analysis/spectrum/spectral-helper';
import { createWelchAccumulator, welch } from '../../analysis/spectrum/welch';
import { makeWindow } from '../../analysis/spectrum/windows';
import { createGaussian } from '../../analysis/synth/gaussian';
import { createRandom } from '../../analysis/synth/prng';

function gaussianNoise(n: number, sigma: number, seed: number): Float64Array {
  const x = new Float64Array(n);
  createGaussian(createRandom(seed)).fill(x, sigma);
  return x;
}

describe('welch: tiny hand-checkable inputs', () => {
  it('welch((−1)^n, hann, L = 8, fs = 1) puts 16/3 on the Nyquist bin (not doubled) and 8/3 next to it', () => {
    // X[4] = Σw = 4, |X|² = 16; X[3] = −L/4 = −2, |X|² = 4; density 1/(fs·Σw²), Σw² = 3L/8 = 3
    const x = Float64Array.from({ length: 8 }, (_, n) => (n % 2 === 0 ? 1 : -1));
    const s = welch(x, { sampleRateHz: 1, segmentLength: 8 });
    expect(s.psd.length).toBe(5);
    expect(s.psd[4]).toBeCloseTo(16 / 3, 12);
    expect(s.psd[3]).toBeCloseTo((2 * 4) / 3, 12);
    expect(s.psd[0]).toBeCloseTo(0, 12);
    expect(s.psd[1]).toBeCloseTo(0, 12);
    expect(Array.from(s.frequencyHz)).toEqual([0, 0.125, 0.25, 0.375, 0.5]);
  });

  it('welch(x, { segment: 1024 }) returns segment/2 + 1 frequencies f_m = m·fs/L', () => {
    const s = welch(new Float64Array(4096), { sampleRateHz: 1000, segmentLength: 1024 });
    expect(s.frequencyHz.length).toBe(513);
    expect(s.frequencyHz[512]).toBe(500);
    expect(s.averages).toBe(7); // ⌊(4096 − 1024)/512⌋ + 1
    expect(s.samplesUsed).toBe(4096);
  });

  it('an odd segment has no Nyquist bin: (L+1)/2 bins, all but DC doubled', () => {
    const x = Float64Array.from({ length: 7 }, (_, n) => Math.cos((2 * Math.PI * 3 * n) / 7));
    const s = welch(x, { sampleRateHz: 7, segmentLength: 7, window: 'hann' });
    expect(s.psd.length).toBe(4);
    expect(s.frequencyHz[3]).toBeCloseTo(3, 14);
  });

  it("a constant is removed by detrend 'constant', a line by detrend 'linear'", () => {
    const line = Float64Array.from({ length: 512 }, (_, n) => 3 + 0.25 * n);
    const c = welch(Float64Array.from({ length: 512 }, () => 5), { sampleRateHz: 1, segmentLength: 128 });
    const l = welch(line, { sampleRateHz: 1, segmentLength: 128, detrend: 'linear' });
    const notRemoved = welch(line, { sampleRateHz: 1, segmentLength: 128, detrend: 'constant' });
    expect(Math.max(...c.psd)).toBeLessThan(1e-25);
    expect(Math.max(...l.psd)).toBeLessThan(1e-20);
    expect(notRemoved.psd[1]).toBeGreaterThan(1);
  });
});

describe('welch: invariants', () => {
  it('Parseval: Σ P[m]·fs/L equals the mean windowed, detrended segment energy / Σw² (1e-12)', () => {
    const x = gaussianNoise(5000, 2, 11);
    const L = 500;
    const hop = 250;
    const fs = 37;
    const s = welch(x, { sampleRateHz: fs, segmentLength: L, overlap: 0.5 });
    let area = 0;
    for (let m = 0; m < s.psd.length; m++) area += (s.psd[m] * fs) / L;
    const w = makeWindow('hann', L);
    let s2 = 0;
    for (let n = 0; n < L; n++) s2 += w[n] * w[n];
    let energy = 0;
    for (let k = 0; k < s.averages; k++) {
      let mean = 0;
      for (let n = 0; n < L; n++) mean += x[k * hop + n];
      mean /= L;
      for (let n = 0; n < L; n++) energy += ((x[k * hop + n] - mean) * w[n]) ** 2;
    }
    expect(area).toBeCloseTo(energy / s.averages / s2, 10);
  });

  it('white noise σ = 1, fs = 1 kHz, Hann L = 1024 reads 2σ²/fs = 2.000e-3 /Hz within 3/√K_eff (METHODS 9 #1)', () => {
    const s = welch(gaussianNoise(2 ** 20, 1, 1), { sampleRateHz: 1000, segmentLength: 1024 });
    expect(s.averages).toBe(2047);
    const tol = 3 / Math.sqrt(s.equivalentAverages);
    let mean = 0;
    for (let m = 4; m < 512; m++) {
      // every single bin from m = 4 up (METHODS 1.4 rule b) within 6/√K_eff (508 bins: a 6σ excursion ~1e-6)
      expect(Math.abs(s.psd[m] / 2e-3 - 1)).toBeLessThan(2 * tol);
      mean += s.psd[m] / 508;
    }
    expect(Math.abs(mean / 2e-3 - 1)).toBeLessThan(tol);
    // bin 1 carries the known bias of removing each segment's mean (METHODS 1.4: 0.82 of the level)
    expect(s.psd[1] / 2e-3).toBeGreaterThan(0.82 - 2 * tol);
    expect(s.psd[1] / 2e-3).toBeLessThan(0.82 + 2 * tol);
    // the variance: Σ P·Δf ≈ σ² = 1
    let area = 0;
    for (let m = 0; m < s.psd.length; m++) area += (s.psd[m] * 1000) / 1024;
    expect(area).toBeGreaterThan(0.98);
    expect(area).toBeLessThan(1.02);
  });

  it("a sine of amplitude A exactly on a bin reads A²/2 in 'spectrum' scaling (hann, blackman-harris, flat-top)", () => {
    const A = 3;
    const L = 1024;
    const x = Float64Array.from({ length: 8 * L }, (_, n) => A * Math.sin((2 * Math.PI * 100 * n) / L + 0.3));
    for (const window of ['hann', 'blackman-harris', 'flat-top'] as const) {
      const s = welch(x, { sampleRateHz: 1, segmentLength: L, window, scaling: 'spectrum' });
      expect(s.psd[100]).toBeCloseTo((A * A) / 2, 9);
    }
  });

  it("flat-top reads a sine between bins within 0.1 % of A²/2 in 'spectrum' scaling (METHODS 1.2: 0.5002 for A = 1)", () => {
    const L = 1024;
    const x = Float64Array.from({ length: 8 * L }, (_, n) => Math.sin((2 * Math.PI * 100.37 * n) / L));
    const s = welch(x, { sampleRateHz: 1, segmentLength: L, window: 'flat-top', scaling: 'spectrum' });
    const peak = Math.max(s.psd[99], s.psd[100], s.psd[101]);
    expect(Math.abs(peak / 0.5 - 1)).toBeLessThan(1e-3);
    const hann = welch(x, { sampleRateHz: 1, segmentLength: L, window: 'hann', scaling: 'spectrum' });
    expect(Math.max(hann.psd[100], hann.psd[101])).toBeLessThan(0.47); // Hann scallops (METHODS: 0.437 half-way)
  });

  it('the density of a sine is its power A²/2 divided by the ENBW', () => {
    const L = 2048;
    const fs = 1e6;
    const x = Float64Array.from({ length: 4 * L }, (_, n) => Math.cos((2 * Math.PI * 300 * n) / L));
    const d = welch(x, { sampleRateHz: fs, segmentLength: L, window: 'blackman-harris' });
    expect(d.psd[300] * d.enbwHz).toBeCloseTo(0.5, 9);
    expect(d.enbwHz).toBeCloseTo((2.004353 * fs) / L, 1);
  });

  it('chunk-size independence: any block sizes give the same estimate bit for bit', () => {
    const x = gaussianNoise(30011, 1, 5);
    const whole = welch(x, { sampleRateHz: 10, segmentLength: 1000, overlap: 0.3, detrend: 'linear' });
    const acc = createWelchAccumulator({ sampleRateHz: 10, segmentLength: 1000, overlap: 0.3, detrend: 'linear' });
    let i = 0;
    let size = 1;
    while (i < x.length) {
      acc.push(x.subarray(i, Math.min(x.length, i + size)));
      i += size;
      size = (size * 7 + 3) % 2311; // irregular sizes, including 0
    }
    const parts = acc.result();
    expect(parts.averages).toBe(whole.averages);
    expect(Array.from(parts.psd)).toEqual(Array.from(whole.psd));
  });

  it('reports K, K_eff, ENBW and the hop from the options', () => {
    const s = welch(new Float64Array(10240), { sampleRateHz: 2000, segmentLength: 1024 });
    expect(s.hop).toBe(512);
    expect(s.averages).toBe(19);
    expect(s.equivalentAverages).toBeCloseTo(19 / (1 + (2 * (18 / 19)) / 36), 10);
    expect(s.enbwHz).toBeCloseTo((1.5 * 2000) / 1024, 12);
    expect(s.window).toBe('hann');
    expect(s.detrend).toBe('constant');
    expect(s.scaling).toBe('density');
  });

  it('accepts a Float32Array input', () => {
    const x64 = gaussianNoise(4096, 1, 9);
    const x32 = Float32Array.from(x64);
    const a = welch(x32, { sampleRateHz: 1, segmentLength: 256 });
    const b = welch(Float64Array.from(x32), { sampleRateHz: 1, segmentLength: 256 });
    expect(Array.from(a.psd)).toEqual(Array.from(b.psd));
  });
});

describe('welch: options', () => {
  it('resolveWelchOptions fills the defaults: hann, L 4096, overlap by window, constant, density', () => {
    expect(resolveWelchOptions({ sampleRateHz: 1 })).toEqual({
      sampleRateHz: 1,
      segmentLength: 4096,
      overlap: 0.5,
      overlapSamples: 2048,
      hop: 2048,
      window: 'hann',
      detrend: 'constant',
      scaling: 'density',
    });
    expect(resolveWelchOptions({ sampleRateHz: 1, window: 'blackman-harris', segmentLength: 1000 }).overlapSamples).toBe(661);
    expect(resolveWelchOptions({ sampleRateHz: 1, window: 'flat-top', segmentLength: 1000 }).overlapSamples).toBe(760);
  });

  it.each([
    [{ sampleRateHz: 0 }, /sampleRateHz/],
    [{ sampleRateHz: Number.NaN }, /sampleRateHz/],
    [{ sampleRateHz: 1, segmentLength: 1 }, /segmentLength/],
    [{ sampleRateHz: 1, segmentLength: 100.5 }, /segmentLength/],
    [{ sampleRateHz: 1, segmentLength: 2 ** 25 }, /segmentLength/],
    [{ sampleRateHz: 1, overlap: 1 }, /overlap/],
    [{ sampleRateHz: 1, overlap: -0.1 }, /overlap/],
    [{ sampleRateHz: 1, window: 'hamming' }, /window/],
    [{ sampleRateHz: 1, detrend: 'quadratic' }, /detrend/],
    [{ sampleRateHz: 1, scaling: 'power' }, /scaling/],
  ])('rejects %o', (options, message) => {
    expect(() => createWelchAccumulator(options as never)).toThrow(AnalysisInputError);
    expect(() => createWelchAccumulator(options as never)).toThrow(message);
  });

  it('result() before one full segment throws AnalysisInputError naming the segment', () => {
    const acc = createWelchAccumulator({ sampleRateHz: 1, segmentLength: 64 });
    acc.push(new Float64Array(63));
    expect(() => acc.result()).toThrow(/fewer than one segment of 64/);
  });
});
