import { describe, expect, it } from 'vitest';
import { AnalysisInputError } from '../../analysis/errors';
import { binomialCoefficients, binomialPowerGain, createDecimatorByTwo } from '../../analysis/spectrum/decimate-by-two';
import { createLogFrequencyAccumulator, type LogFrequencyOptions } from '../../analysis/spectrum/log-frequency';
import { welch } from '../../analysis/spectrum/welch';
import { createSynthGenerator } from '../../analysis/synth/generator';
import type { SynthOptions } from '../../analysis/synth/synth-options';

function run(options: LogFrequencyOptions, synth: SynthOptions, samples: number, block = 50000) {
  const gen = createSynthGenerator(synth);
  const acc = createLogFrequencyAccumulator(options);
  for (let done = 0; done < samples; done += block) acc.push(gen.next(Math.min(block, samples - done)).channels[0]);
  return acc.result();
}

describe('createDecimatorByTwo (binomial / CIC prefilter)', () => {
  it('binomialCoefficients(4) = [1, 4, 6, 4, 1]/16', () => {
    expect(Array.from(binomialCoefficients(4))).toEqual([1, 4, 6, 4, 1].map((c) => c / 16));
  });

  it('a constant passes unchanged; q = 2 on [0, 4, 0, 4, …] gives 2, 2, …; N inputs → ⌈(N − q)/2⌉ outputs', () => {
    const d = createDecimatorByTwo(3);
    const y = d.push(new Float64Array(11).fill(7));
    expect(y.length).toBe(4);
    for (const v of y) expect(v).toBeCloseTo(7, 14);
    const alt = createDecimatorByTwo(2).push(Float64Array.from({ length: 10 }, (_, k) => (k % 2) * 4));
    expect(Array.from(alt)).toEqual([2, 2, 2, 2]);
  });

  it('blocks of any size give the same output as one block', () => {
    const x = Float64Array.from({ length: 1001 }, (_, k) => Math.sin(k * 0.37) + k * 1e-3);
    const whole = Array.from(createDecimatorByTwo(6).push(x));
    const d = createDecimatorByTwo(6);
    const parts: number[] = [];
    for (const [a, b] of [[0, 1], [1, 4], [4, 5], [5, 600], [600, 1001]]) parts.push(...d.push(x.subarray(a, b)));
    expect(parts).toEqual(whole);
  });

  it('binomialPowerGain is cos^{2q}(πf/fs): 1 at DC, 0 at Nyquist, 2^{−q}… at fs/4', () => {
    expect(binomialPowerGain(0, 1, 6)).toBe(1);
    expect(binomialPowerGain(0.5, 1, 6)).toBeLessThan(1e-30);
    expect(binomialPowerGain(0.25, 1, 6)).toBeCloseTo(0.5 ** 6, 14);
  });

  it('rejects an order outside [1, 16]', () => {
    expect(() => createDecimatorByTwo(0)).toThrow(/order/);
    expect(() => createDecimatorByTwo(17)).toThrow(/order/);
  });
});

describe('createLogFrequencyAccumulator (decimation cascade, stitched)', () => {
  const fs = 1e4;

  it('white noise h0: every point reads h0 within 5/√K of its segments (K ≥ 2), from the lowest point up to fs/2', () => {
    const h0 = 2;
    const s = run({ sampleRateHz: fs, segmentLength: 512, pointsPerDecade: 10 }, { sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: h0, seed: 31 }, 2 ** 20);
    for (let i = 0; i < s.psd.length; i++) {
      const tol = 5 / Math.sqrt(s.averages[i] * 0.9) + 0.01;
      expect(Math.abs(s.psd[i] / h0 - 1), `at ${s.frequencyHz[i]} Hz, K = ${s.averages[i]}`).toBeLessThan(Math.min(tol, 4));
    }
    expect(s.frequencyHz[s.frequencyHz.length - 1]).toBeGreaterThan(0.4 * fs);
  });

  it('reaches 1/T0: the lowest point lies in [1/T0, 2.1/T0] and is flagged below reliableFromHz', () => {
    for (const samples of [100_000, 2 ** 17, 300_001]) {
      const s = run({ sampleRateHz: fs, segmentLength: 256, pointsPerDecade: 0 }, { sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: 1 }, samples);
      const T0 = samples / fs;
      expect(s.frequencyHz[0] * T0).toBeGreaterThanOrEqual(1);
      expect(s.frequencyHz[0] * T0).toBeLessThanOrEqual(2.1);
      expect(s.reliableFromHz).toBeGreaterThan(s.frequencyHz[0]);
      expect(s.averages[0]).toBeGreaterThanOrEqual(1);
    }
  });

  it('random-walk FM: S_ν follows h₋₂·π²/(fs²·sin²(πf/fs)) (the sampled random walk) within 10 % + 4/√K above reliableFromHz', () => {
    const h = 0.5;
    const s = run(
      { sampleRateHz: fs, segmentLength: 1024, pointsPerDecade: 8, detrend: 'linear' },
      { sampleRateHz: fs, output: 'frequency', randomWalkHz3: h, seed: 32 },
      2 ** 21,
    );
    let checked = 0;
    for (let i = 0; i < s.psd.length; i++) {
      const f = s.frequencyHz[i];
      if (f < s.reliableFromHz) continue;
      const model = (h * Math.PI ** 2) / (fs ** 2 * Math.sin((Math.PI * f) / fs) ** 2);
      // 10 %: Hann leakage of a 1/f² series in bins 4-7 (METHODS 1.4: +8 % at bin 4); 4/√K: χ² scatter
      expect(Math.abs(s.psd[i] / model - 1), `at ${f} Hz`).toBeLessThan(0.1 + 4 / Math.sqrt(s.averages[i]));
      checked++;
    }
    expect(checked).toBeGreaterThan(25);
  });

  it('stage 0 equals a plain Welch estimate of the same L above minBin·fs/L (pointsPerDecade 0)', () => {
    const gen = createSynthGenerator({ sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: 1, flickerHz2: 100, seed: 33 });
    const x = gen.next(200_000).channels[0];
    const acc = createLogFrequencyAccumulator({ sampleRateHz: fs, segmentLength: 1024, pointsPerDecade: 0 });
    acc.push(x);
    const s = acc.result();
    const w = welch(x, { sampleRateHz: fs, segmentLength: 1024 });
    let compared = 0;
    for (let i = 0; i < s.psd.length; i++) {
      if (s.stage[i] !== 0) continue;
      const m = Math.round((s.frequencyHz[i] * 1024) / fs);
      expect(m).toBeGreaterThanOrEqual(4);
      expect(s.psd[i]).toBe(w.psd[m]);
      expect(s.averages[i]).toBe(w.averages);
      compared++;
    }
    expect(compared).toBe(512 - 4); // bins 4..511: the Nyquist bin is left out
  });

  it('with L = L\' = 256 each deeper stage serves bins [minBin, 2·minBin) at resolution fs/(2^s·L); frequencies ascend', () => {
    const s = run({ sampleRateHz: fs, segmentLength: 256, pointsPerDecade: 0 }, { sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: 1 }, 400_000);
    for (let i = 1; i < s.frequencyHz.length; i++) expect(s.frequencyHz[i]).toBeGreaterThan(s.frequencyHz[i - 1]);
    for (let i = 0; i < s.frequencyHz.length; i++) {
      expect(s.resolutionHz[i]).toBeCloseTo(fs / 2 ** s.stage[i] / 256, 12);
      const bin = s.frequencyHz[i] / s.resolutionHz[i];
      if (s.frequencyHz[i] >= s.reliableFromHz && s.stage[i] > 0) {
        expect(bin).toBeGreaterThanOrEqual(4);
        expect(bin).toBeLessThan(8);
      }
    }
  });

  it("deeper stages use L' = 1024 under L = 4096: levels 0, 3, 4, … with resolution fs/(2^s·1024), bins [4, 8), white level kept", () => {
    const h0 = 0.7;
    const s = run({ sampleRateHz: fs, segmentLength: 4096, pointsPerDecade: 0 }, { sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: h0, seed: 35 }, 2 ** 21);
    const levels = [...new Set(Array.from(s.stage))].sort((a, b) => a - b);
    expect(levels.slice(0, 3)).toEqual([0, 3, 4]);
    let ratio = 0;
    let count = 0;
    for (let i = 0; i < s.frequencyHz.length; i++) {
      const L = s.stage[i] === 0 ? 4096 : 1024;
      expect(s.resolutionHz[i]).toBeCloseTo(fs / 2 ** s.stage[i] / L, 12);
      if (s.stage[i] > 0 && s.frequencyHz[i] >= s.reliableFromHz) {
        const bin = s.frequencyHz[i] / s.resolutionHz[i];
        expect(bin).toBeGreaterThanOrEqual(4);
        expect(bin).toBeLessThan(8);
        ratio += s.psd[i] / h0;
        count++;
      }
    }
    // deep-stage points, weighted alike: their mean within 10 % of the white level
    expect(count).toBeGreaterThan(20);
    expect(Math.abs(ratio / count - 1)).toBeLessThan(0.1);
    // the stitched grid is continuous: stage 0 starts where level 3 stops
    const firstStage0 = Array.from(s.stage).indexOf(0);
    expect(s.frequencyHz[firstStage0]).toBeCloseTo((4 * fs) / 4096, 9);
    expect(s.frequencyHz[firstStage0 - 1]).toBeCloseTo((7 * fs) / 8 / 1024, 9);
  });

  it('block sizes do not change the result', () => {
    const synth: SynthOptions = { sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: 1, randomWalkHz3: 0.1, seed: 34 };
    const a = run({ sampleRateHz: fs, segmentLength: 256 }, synth, 150_000, 150_000);
    const b = run({ sampleRateHz: fs, segmentLength: 256 }, synth, 150_000, 777);
    expect(Array.from(b.psd)).toEqual(Array.from(a.psd));
    expect(Array.from(b.averages)).toEqual(Array.from(a.averages));
  });

  it('rejects a record shorter than one segment, and bad options', () => {
    const acc = createLogFrequencyAccumulator({ sampleRateHz: 1, segmentLength: 64 });
    acc.push(new Float64Array(10));
    expect(() => acc.result()).toThrow(/fewer than one segment/);
    const bad: [LogFrequencyOptions, RegExp][] = [
      [{ sampleRateHz: 1, segmentLength: 32 }, /16·minBin/],
      [{ sampleRateHz: 1, minBin: 0 }, /minBin/],
      [{ sampleRateHz: 1, minAverages: 0 }, /minAverages/],
      [{ sampleRateHz: 1, pointsPerDecade: -1 }, /pointsPerDecade/],
      [{ sampleRateHz: 1, decimatorOrder: 1 }, /decimatorOrder/],
      [{ sampleRateHz: 0 }, /sampleRateHz/],
      [{ sampleRateHz: 1, segmentLength: 1024, cascadeSegmentLength: 2048 }, /cascadeSegmentLength/],
      [{ sampleRateHz: 1, segmentLength: 1024, cascadeSegmentLength: 32 }, /cascadeSegmentLength/],
    ];
    for (const [o, msg] of bad) {
      expect(() => createLogFrequencyAccumulator(o)).toThrow(AnalysisInputError);
      expect(() => createLogFrequencyAccumulator(o)).toThrow(msg);
    }
  });
});
