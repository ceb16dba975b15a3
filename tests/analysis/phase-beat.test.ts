import { describe, expect, it } from 'vitest';
import { createBeatDemodulator, resolveBeatOptions } from '../../analysis/phase/beat-demodulator';
import { createFrequencyStage, type FrequencyStageOptions } from '../../analysis/phase/frequency-stage';
import { estimateIntermediateFrequency } from '../../analysis/phase/intermediate-frequency';
import { designLowpassFir, lowpassTapCount } from '../../analysis/phase/lowpass-fir';
import { createOverlapSaveFilter } from '../../analysis/phase/overlap-save';
import { welch } from '../../analysis/spectrum/welch';
import { synthesize } from '../../analysis/synth/generator';
import type { SynthOptions } from '../../analysis/synth/synth-options';
import type { SampleBlock } from '../../analysis/types';

function frequencyOf(options: FrequencyStageOptions, block: SampleBlock) {
  const stage = createFrequencyStage(options);
  const a = stage.push(block);
  const { tail, summary } = stage.finish();
  const nu = new Float64Array(a.length + tail.length);
  nu.set(a);
  nu.set(tail, a.length);
  return { nu, summary };
}

describe('designLowpassFir (windowed sinc, Blackman-Harris)', () => {
  it('has unit DC gain, is symmetric, and is a half-band filter at fc = fs/4', () => {
    const h = designLowpassFir(1, 0.25, 31);
    expect(h.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    for (let n = 0; n < 31; n++) expect(h[n]).toBeCloseTo(h[30 - n], 15);
    for (const k of [2, 4, 6, 8]) expect(Math.abs(h[15 + k])).toBeLessThan(1e-16);
  });

  it('is flat to 1e-3 dB in the pass band and 90 dB down in the stop band (tap count from lowpassTapCount)', () => {
    const fs = 1e6;
    const taps = lowpassTapCount(fs, 1e5, 1.5e5);
    const h = designLowpassFir(fs, 1.25e5, taps);
    const gain = (f: number) => {
      let re = 0;
      let im = 0;
      for (let n = 0; n < h.length; n++) {
        re += h[n] * Math.cos((2 * Math.PI * f * n) / fs);
        im -= h[n] * Math.sin((2 * Math.PI * f * n) / fs);
      }
      return Math.hypot(re, im);
    };
    for (const f of [0, 2e4, 5e4, 8e4, 1e5]) expect(Math.abs(20 * Math.log10(gain(f)))).toBeLessThan(1e-3);
    for (const f of [1.5e5, 2e5, 3e5, 4.9e5]) expect(20 * Math.log10(gain(f))).toBeLessThan(-90);
  });
});

describe('createOverlapSaveFilter', () => {
  it('equals direct convolution (valid part), whatever the block sizes, with decimation', () => {
    const h = Float64Array.from({ length: 37 }, (_, j) => Math.sin(j + 1) / (j + 2));
    const n = 9000;
    const re = Float64Array.from({ length: n }, (_, k) => Math.cos(0.01 * k * k));
    const im = Float64Array.from({ length: n }, (_, k) => Math.sin(0.3 * k));
    const D = 3;
    const f = createOverlapSaveFilter(h, { decimation: D, fftSize: 128 });
    const outRe: number[] = [];
    const outIm: number[] = [];
    for (const [a, b] of [[0, 5], [5, 1000], [1000, 1001], [1001, n]]) {
      const y = f.push(re.subarray(a, b), im.subarray(a, b));
      outRe.push(...y.re);
      outIm.push(...y.im);
    }
    const last = f.finish();
    outRe.push(...last.re);
    outIm.push(...last.im);
    const M = h.length;
    expect(outRe.length).toBe(Math.ceil((n - M + 1) / D));
    for (let i = 0; i < outRe.length; i++) {
      const k = i * D + M - 1; // newest input of output i
      let sr = 0;
      let si = 0;
      for (let j = 0; j < M; j++) {
        sr += h[j] * re[k - j];
        si += h[j] * im[k - j];
      }
      expect(outRe[i]).toBeCloseTo(sr, 10);
      expect(outIm[i]).toBeCloseTo(si, 10);
    }
  });
});

describe('estimateIntermediateFrequency', () => {
  it('cos(2π·0.1234·n) over 8192 samples: within fs/8192 of 0.1234·fs', () => {
    const v = Float64Array.from({ length: 8192 }, (_, n) => Math.cos(2 * Math.PI * 0.1234 * n) + 0.5);
    expect(Math.abs(estimateIntermediateFrequency(v, 1e6) - 1.234e5)).toBeLessThan(1e6 / 8192);
  });

  it('refuses a record without a line away from DC, and a record under 64 samples', () => {
    expect(() => estimateIntermediateFrequency(new Float64Array(32), 1)).toThrow(/at least 64/);
    const lowpass = Float64Array.from({ length: 4096 }, (_, n) => Math.cos(2 * Math.PI * (0.2 / 4096) * n));
    expect(() => estimateIntermediateFrequency(lowpass, 1)).toThrow(/DC or Nyquist/);
  });
});

describe("createFrequencyStage({ kind: 'beat' })", () => {
  const fs = 1e6;
  const model: Omit<SynthOptions, 'output'> = { sampleRateHz: fs, whiteHz2PerHz: 100, flickerHz2: 1e5, flickerLowestHz: 1, seed: 4 };
  const n = 2 ** 20;

  it('reproduces the IQ path S_ν in band: bin by bin within 1 % to 10 kHz, band mean within 2 % over 20-50 kHz', () => {
    const iq = frequencyOf({ kind: 'iq', sampleRateHz: fs }, synthesize({ ...model, output: 'iq' }, n));
    const beat = frequencyOf(
      { kind: 'beat', sampleRateHz: fs, intermediateFrequencyHz: 2.5e5 },
      synthesize({ ...model, output: 'beat', intermediateFrequencyHz: 2.5e5 }, n),
    );
    expect(beat.summary.bandwidthHz).toBeCloseTo(0.75 * 2.5e5, 6);
    // same ν realisation; the FIR (M taps) delays by (M − 1)/2 samples and eats M − 1 of them
    const lost = iq.nu.length - beat.nu.length;
    const aligned = iq.nu.subarray(lost / 2, lost / 2 + beat.nu.length);
    const a = welch(aligned, { sampleRateHz: fs, segmentLength: 8192 });
    const b = welch(beat.nu, { sampleRateHz: fs, segmentLength: 8192 });
    let worst = 0;
    let bandRatio = 0;
    let bandCount = 0;
    for (let m = 1; m < a.psd.length; m++) {
      const f = a.frequencyHz[m];
      if (f >= 100 && f <= 1e4) worst = Math.max(worst, Math.abs(b.psd[m] / a.psd[m] - 1));
      if (f >= 2e4 && f <= 5e4) {
        bandRatio += b.psd[m] / a.psd[m];
        bandCount++;
      }
    }
    expect(worst).toBeLessThan(0.01);
    // the wings of the line's negative-frequency copy add ≈ (f/2f_IF)² (≤ 1 % at 50 kHz); see beat-demodulator.ts
    expect(Math.abs(bandRatio / bandCount - 1)).toBeLessThan(0.02);
    // the mean beat frequency: IF + the carrier's own mean offset
    expect(beat.summary.carrierOffsetHz - 2.5e5).toBeCloseTo(iq.summary.carrierOffsetHz, 0);
  });

  it('finds the IF from the spectrum peak when it is not given', () => {
    const beat = frequencyOf({ kind: 'beat', sampleRateHz: fs }, synthesize({ ...model, output: 'beat', intermediateFrequencyHz: 2.1e5 }, 2 ** 17));
    expect(beat.summary.intermediateFrequencySource).toBe('spectrum-peak');
    // the carrier wanders by its flicker (~1 kHz rms) over the 65536-sample search stretch
    expect(Math.abs(beat.summary.intermediateFrequencyHz! - 2.1e5)).toBeLessThan(5e3);
    expect(beat.summary.bandwidthHz).toBeCloseTo(0.75 * Math.min(beat.summary.intermediateFrequencyHz!, fs / 2 - beat.summary.intermediateFrequencyHz!), 6);
  });

  it('a short record (< ifSearchSamples) still finds the IF at finish()', () => {
    const beat = frequencyOf({ kind: 'beat', sampleRateHz: fs }, synthesize({ ...model, output: 'beat', intermediateFrequencyHz: 1.5e5 }, 5000));
    expect(beat.summary.intermediateFrequencySource).toBe('spectrum-peak');
    expect(beat.nu.length).toBeGreaterThan(4000);
  });

  it('additive noise N0 = 5e-11 V²/Hz on A = 1 reads S_φ = N0/(A²/2) = 1e-10 rad²/Hz within 3 % (METHODS 2.6, 9 #18)', () => {
    const block = synthesize({ sampleRateHz: fs, output: 'beat', intermediateFrequencyHz: 2.5e5, additiveNoiseDensity: 5e-11, seed: 8 }, n);
    const { nu } = frequencyOf({ kind: 'beat', sampleRateHz: fs, intermediateFrequencyHz: 2.5e5 }, block);
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 4096 });
    let sum = 0;
    let count = 0;
    for (let m = 0; m < s.psd.length; m++) {
      const f = s.frequencyHz[m];
      if (f >= 2e4 && f <= 9e4) {
        sum += s.psd[m] / (f * f); // S_φ = S_ν/f²
        count++;
      }
    }
    expect(Math.abs(sum / count / 1e-10 - 1)).toBeLessThan(0.03);
  });

  it('decimation by 2 halves the output rate and keeps S_ν in band', () => {
    const block = synthesize({ ...model, output: 'beat', intermediateFrequencyHz: 2.5e5 }, n);
    const full = frequencyOf({ kind: 'beat', sampleRateHz: fs, intermediateFrequencyHz: 2.5e5 }, block);
    const half = frequencyOf({ kind: 'beat', sampleRateHz: fs, intermediateFrequencyHz: 2.5e5, decimation: 2 }, block);
    expect(half.summary.outputRateHz).toBe(fs / 2);
    const a = welch(full.nu, { sampleRateHz: fs, segmentLength: 8192 });
    const b = welch(half.nu, { sampleRateHz: fs / 2, segmentLength: 4096 });
    let ratio = 0;
    let count = 0;
    for (let m = 10; b.frequencyHz[m] <= 4e4; m++) {
      ratio += b.psd[m] / a.psd[m];
      count++;
    }
    expect(Math.abs(ratio / count - 1)).toBeLessThan(0.03);
  });
});

describe('resolveBeatOptions', () => {
  it('defaults: B = 0.75·min(f_IF, fs/2 − f_IF), stop edge d, cut-off (B + d)/2, decimation 1', () => {
    const o = resolveBeatOptions({ sampleRateHz: 1e6, intermediateFrequencyHz: 3e5 });
    expect(o.stopHz).toBeCloseTo(2e5, 6);
    expect(o.bandwidthHz).toBeCloseTo(1.5e5, 6);
    expect(o.cutoffHz).toBeCloseTo(1.75e5, 6);
    expect(o.decimation).toBe(1);
    expect(o.taps % 2).toBe(1);
  });

  it('the demodulated phase of a pure tone at IF + 1 kHz advances by 2π·1 kHz/fs per sample', () => {
    const fs = 1e6;
    const v = Float64Array.from({ length: 20000 }, (_, k) => Math.cos((2 * Math.PI * 251e3 * k) / fs));
    const d = createBeatDemodulator(resolveBeatOptions({ sampleRateHz: fs, intermediateFrequencyHz: 2.5e5 }));
    const z = d.push(v);
    for (let k = 1; k < z.re.length; k += 101) {
      let step = Math.atan2(z.im[k], z.re[k]) - Math.atan2(z.im[k - 1], z.re[k - 1]);
      step -= 2 * Math.PI * Math.round(step / (2 * Math.PI));
      // the image at −(2·f_IF + 1 kHz) leaks through the −92 dB stop band: phase ripple ≲ 1e-5 rad
      expect(Math.abs(step - (2 * Math.PI * 1e3) / fs)).toBeLessThan(1e-6);
      expect(Math.hypot(z.re[k], z.im[k])).toBeCloseTo(0.5, 4); // A/2: the ×2 of the analytic signal is dropped
    }
  });
});
