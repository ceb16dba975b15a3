import { describe, expect, it } from 'vitest';
import { AnalysisInputError } from '../../analysis/errors';
import { createFrequencyStage, type FrequencyStageOptions } from '../../analysis/phase/frequency-stage';
import { welch } from '../../analysis/spectrum/welch';
import { createSynthGenerator, synthesize } from '../../analysis/synth/generator';
import type { SampleBlock } from '../../analysis/types';

function runStage(options: FrequencyStageOptions, blocks: SampleBlock[]) {
  const stage = createFrequencyStage(options);
  const parts: Float64Array[] = blocks.map((b) => stage.push(b));
  const { tail, summary } = stage.finish();
  parts.push(tail);
  const n = parts.reduce((a, p) => a + p.length, 0);
  const nu = new Float64Array(n);
  let o = 0;
  for (const p of parts) {
    nu.set(p, o);
    o += p.length;
  }
  return { nu, summary, stage };
}

function cut(block: SampleBlock, sizes: number[]): SampleBlock[] {
  const out: SampleBlock[] = [];
  let i = 0;
  let j = 0;
  const n = block.channels[0].length;
  while (i < n) {
    const size = sizes[j++ % sizes.length];
    out.push({ channels: block.channels.map((c) => c.subarray(i, Math.min(n, i + size))) });
    i += size;
  }
  return out;
}

describe("createFrequencyStage({ kind: 'iq' })", () => {
  it('a tone e^{2πi·f0·t} gives ν = f0 in every sample, carrier offset f0 and no drift', () => {
    const fs = 1e5;
    const f0 = 1234.5;
    const n = 4000;
    const I = Float64Array.from({ length: n }, (_, k) => 2 * Math.cos((2 * Math.PI * f0 * k) / fs));
    const Q = Float64Array.from({ length: n }, (_, k) => 2 * Math.sin((2 * Math.PI * f0 * k) / fs));
    const { nu, summary } = runStage({ kind: 'iq', sampleRateHz: fs }, [{ channels: [I, Q] }]);
    expect(nu.length).toBe(n - 1);
    for (const v of nu) expect(v).toBeCloseTo(f0, 6);
    expect(summary.carrierOffsetHz).toBeCloseTo(f0, 6);
    expect(Math.abs(summary.driftHzPerS)).toBeLessThan(1e-6);
    expect(summary.frequencySamples).toBe(n - 1);
    expect(summary.inputSamples).toBe(n);
    expect(summary.outputRateHz).toBe(fs);
    expect(summary.warnings).toEqual([]);
  });

  it('a negative offset wraps correctly (z = e^{−2πi·f0·t} gives −f0)', () => {
    const fs = 1000;
    const I = Float64Array.from({ length: 100 }, (_, k) => Math.cos((2 * Math.PI * -300 * k) / fs));
    const Q = Float64Array.from({ length: 100 }, (_, k) => Math.sin((2 * Math.PI * -300 * k) / fs));
    const { nu } = runStage({ kind: 'iq', sampleRateHz: fs }, [{ channels: [I, Q] }]);
    for (const v of nu) expect(v).toBeCloseTo(-300, 8);
  });

  it('a linear chirp reports its drift in Hz/s', () => {
    const fs = 1e4;
    const n = 20000;
    const rate = 150; // Hz/s
    const I = new Float64Array(n);
    const Q = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const t = k / fs;
      const phi = 2 * Math.PI * (50 * t + 0.5 * rate * t * t);
      I[k] = Math.cos(phi);
      Q[k] = Math.sin(phi);
    }
    const { summary } = runStage({ kind: 'iq', sampleRateHz: fs }, [{ channels: [I, Q] }]);
    expect(summary.driftHzPerS).toBeCloseTo(rate, 4);
  });

  it('the frequency samples do not depend on the block sizes (iq, phase, frequency, beat)', () => {
    const fs = 2e5;
    for (const output of ['iq', 'phase', 'frequency', 'beat'] as const) {
      const block = synthesize({ sampleRateHz: fs, output, whiteHz2PerHz: 50, seed: 9 }, 30000);
      const whole = runStage({ kind: output, sampleRateHz: fs, ...(output === 'beat' ? { intermediateFrequencyHz: 5e4 } : {}) }, [block]);
      const parts = runStage(
        { kind: output, sampleRateHz: fs, ...(output === 'beat' ? { intermediateFrequencyHz: 5e4 } : {}) },
        cut(block, [1, 1000, 3, 7777, 4096, 2]),
      );
      expect(Array.from(parts.nu)).toEqual(Array.from(whole.nu));
    }
  });

  it('synthetic white FM h0: time-domain variance of ν is h0·fs/2 (1 %) and the Welch floor is h0 (5 %)', () => {
    const fs = 1e6;
    const h0 = 1e4;
    const gen = createSynthGenerator({ sampleRateHz: fs, output: 'iq', whiteHz2PerHz: h0, carrierOffsetHz: 2e4, seed: 12 });
    const blocks = Array.from({ length: 16 }, () => gen.next(65536));
    const { nu, summary } = runStage({ kind: 'iq', sampleRateHz: fs }, blocks);
    let mean = 0;
    for (const v of nu) mean += v / nu.length;
    let variance = 0;
    for (const v of nu) variance += (v - mean) ** 2 / nu.length;
    // one-sided white density h0 ⇔ per-sample variance h0·fs/2 (2σ²/fs = h0), ± 3·√(2/N) ≈ 0.4 %
    expect(Math.abs(variance / ((h0 * fs) / 2) - 1)).toBeLessThan(0.01);
    // the record mean of white FM scatters by σ/√N = √(h0·fs/2/N)
    expect(Math.abs(summary.carrierOffsetHz - 2e4)).toBeLessThan(4 * Math.sqrt((h0 * fs) / 2 / nu.length));
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 4096 });
    let floor = 0;
    let count = 0;
    for (let m = 4; m < s.psd.length; m++) {
      floor += s.psd[m];
      count++;
    }
    // the differenced phase of sampled white FM is white up to Nyquist (METHODS 2.4): no 1/sinc² rise
    expect(Math.abs(floor / count / h0 - 1)).toBeLessThan(0.05);
    const top = s.psd.slice(1800, 2048).reduce((a, b) => a + b, 0) / 248;
    expect(Math.abs(top / h0 - 1)).toBeLessThan(0.05);
  });

  it('samples with |z| ≈ 0 are counted and warned about', () => {
    const n = 1000;
    const I = Float64Array.from({ length: n }, (_, k) => Math.cos(k * 0.1));
    const Q = Float64Array.from({ length: n }, (_, k) => Math.sin(k * 0.1));
    for (const k of [100, 500, 501]) {
      I[k] = 0;
      Q[k] = 1e-9;
    }
    const { summary } = runStage({ kind: 'iq', sampleRateHz: 1 }, [{ channels: [I, Q] }]);
    expect(summary.lowAmplitudeSamples).toBe(3);
    expect(summary.warnings.some((w) => /amplitude below 1\/1000/.test(w))).toBe(true);
  });

  it('phase steps beyond 0.8π are counted and warned about (METHODS 2.7)', () => {
    const I = Float64Array.from({ length: 50 }, (_, k) => Math.cos(k * 0.9 * Math.PI));
    const Q = Float64Array.from({ length: 50 }, (_, k) => Math.sin(k * 0.9 * Math.PI));
    const { summary } = runStage({ kind: 'iq', sampleRateHz: 1 }, [{ channels: [I, Q] }]);
    expect(summary.largeStepSamples).toBe(49);
    expect(summary.warnings.some((w) => /exceeded 0\.8π/.test(w))).toBe(true);
  });
});

describe("createFrequencyStage({ kind: 'phase' | 'frequency' })", () => {
  it("'phase': ν[k] = fs/(2π)·(φ[k] − φ[k−1]) on an unwrapped ramp", () => {
    const fs = 500;
    const phi = Float64Array.from({ length: 10 }, (_, k) => 0.1 * k * k);
    const { nu } = runStage({ kind: 'phase', sampleRateHz: fs }, [{ channels: [phi] }]);
    for (let k = 1; k < 10; k++) expect(nu[k - 1]).toBeCloseTo((fs / (2 * Math.PI)) * (phi[k] - phi[k - 1]), 10);
  });

  it("'phase': a wrapped record gives the same ν as the unwrapped one", () => {
    const fs = 1;
    const phi = Float64Array.from({ length: 200 }, (_, k) => 0.05 * k * k * 0.01 + 2 * k);
    const wrapped = phi.map((p) => Math.atan2(Math.sin(p), Math.cos(p)));
    const a = runStage({ kind: 'phase', sampleRateHz: fs }, [{ channels: [phi] }]).nu;
    const b = runStage({ kind: 'phase', sampleRateHz: fs }, [{ channels: [Float64Array.from(wrapped)] }]).nu;
    for (let k = 0; k < a.length; k++) expect(b[k]).toBeCloseTo(a[k], 9);
  });

  it("'frequency' passes the samples through (a copy) and reports their mean", () => {
    const x = Float64Array.of(1, 2, 3, 4);
    const { nu, summary } = runStage({ kind: 'frequency', sampleRateHz: 1 }, [{ channels: [x] }]);
    expect(Array.from(nu)).toEqual([1, 2, 3, 4]);
    expect(nu).not.toBe(x);
    expect(summary.carrierOffsetHz).toBe(2.5);
    expect(summary.driftHzPerS).toBeCloseTo(1, 12);
  });
});

describe('createFrequencyStage options and misuse', () => {
  it.each([
    [{ kind: 'voltage', sampleRateHz: 1 }, /kind must be one of/],
    [{ kind: 'iq', sampleRateHz: 0 }, /sampleRateHz/],
    [{ kind: 'iq', sampleRateHz: 1, intermediateFrequencyHz: 0.1 }, /beat-note captures only/],
    [{ kind: 'phase', sampleRateHz: 1, decimation: 2 }, /beat-note captures only/],
    [{ kind: 'beat', sampleRateHz: 1e6, intermediateFrequencyHz: 6e5 }, /intermediateFrequencyHz/],
    [{ kind: 'beat', sampleRateHz: 1e6, intermediateFrequencyHz: 1e5, bandwidthHz: 1e5 }, /bandwidthHz/],
    [{ kind: 'beat', sampleRateHz: 1e6, intermediateFrequencyHz: 2.5e5, decimation: 3 }, /decimation 3/],
    [{ kind: 'beat', sampleRateHz: 1e6, ifSearchSamples: 10 }, /ifSearchSamples/],
    [{ kind: 'beat', sampleRateHz: 1e6, intermediateFrequencyHz: 1 }, /filter taps/],
  ])('rejects %o', (options, message) => {
    expect(() => createFrequencyStage(options as never)).toThrow(AnalysisInputError);
    expect(() => createFrequencyStage(options as never)).toThrow(message);
  });

  it('rejects a block with the wrong channel count or unequal I and Q', () => {
    const s = createFrequencyStage({ kind: 'iq', sampleRateHz: 1 });
    expect(() => s.push({ channels: [new Float64Array(3)] })).toThrow(/needs 2 channels/);
    expect(() => s.push({ channels: [new Float64Array(3), new Float64Array(2)] })).toThrow(/differ in length/);
    const p = createFrequencyStage({ kind: 'phase', sampleRateHz: 1 });
    expect(() => p.push({ channels: [new Float64Array(3), new Float64Array(3)] })).toThrow(/needs 1 channel/);
  });

  it('push after finish and a second finish are refused', () => {
    const s = createFrequencyStage({ kind: 'frequency', sampleRateHz: 1 });
    s.finish();
    expect(() => s.push({ channels: [new Float64Array(1)] })).toThrow(/finished/);
    expect(() => s.finish()).toThrow(/already/);
  });
});
