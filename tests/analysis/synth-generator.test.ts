import { describe, expect, it } from 'vitest';
import { AnalysisInputError } from '../../analysis/errors';
import { createLogFrequencyAccumulator } from '../../analysis/spectrum/log-frequency';
import { welch } from '../../analysis/spectrum/welch';
import { flickerBankPsd, flickerPoles } from '../../analysis/synth/flicker-bank';
import { createSynthGenerator, synthesize } from '../../analysis/synth/generator';
import { resonanceCoefficients, resonancePsd } from '../../analysis/synth/resonance';
import type { SynthOptions } from '../../analysis/synth/synth-options';
import type { LogFrequencySpectrum } from '../../analysis/types';

function logFrequencyOf(options: SynthOptions, samples: number): LogFrequencySpectrum {
  const gen = createSynthGenerator(options);
  const acc = createLogFrequencyAccumulator({ sampleRateHz: options.sampleRateHz, segmentLength: 1024, pointsPerDecade: 10 });
  for (let done = 0; done < samples; done += 65536) acc.push(gen.next(Math.min(65536, samples - done)).channels[0]);
  return acc.result();
}

/** least-squares slope of log10 S against log10 f over [lo, hi] */
function logLogSlope(s: LogFrequencySpectrum, lo: number, hi: number): number {
  const xs: number[] = [];
  const ys: number[] = [];
  for (let i = 0; i < s.frequencyHz.length; i++) {
    if (s.frequencyHz[i] >= lo && s.frequencyHz[i] <= hi) {
      xs.push(Math.log10(s.frequencyHz[i]));
      ys.push(Math.log10(s.psd[i]));
    }
  }
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length;
  const my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < xs.length; i++) {
    sxy += (xs[i] - mx) * (ys[i] - my);
    sxx += (xs[i] - mx) ** 2;
  }
  return sxy / sxx;
}

describe('synthetic frequency noise: the generated S_ν follows the model', () => {
  const fs = 1000;
  const n = 2 ** 21;

  it('white FM h0: Welch floor h0 within 5 % (all bins from 4 up) and per-sample variance h0·fs/2', () => {
    const nu = synthesize({ sampleRateHz: fs, output: 'frequency', whiteHz2PerHz: 3, seed: 2 }, 2 ** 20).channels[0];
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 1024 });
    const floor = s.psd.slice(4, 512).reduce((a, b) => a + b, 0) / 508;
    expect(Math.abs(floor / 3 - 1)).toBeLessThan(0.05);
    const variance = nu.reduce((a, v) => a + v * v, 0) / nu.length;
    expect(Math.abs(variance / 1500 - 1)).toBeLessThan(0.01);
  });

  it('flicker FM h₋₁/f: log-log slope −1 ± 0.1 from 0.1 Hz to fs/10, level within 10 %', () => {
    const s = logFrequencyOf({ sampleRateHz: fs, output: 'frequency', flickerHz2: 50, flickerLowestHz: 0.01, seed: 3 }, n);
    expect(Math.abs(logLogSlope(s, 0.1, 100) + 1)).toBeLessThan(0.1);
    let ratio = 0;
    let count = 0;
    for (let i = 0; i < s.frequencyHz.length; i++) {
      if (s.frequencyHz[i] >= 1 && s.frequencyHz[i] <= 100) {
        ratio += s.psd[i] / (50 / s.frequencyHz[i]);
        count++;
      }
    }
    expect(Math.abs(ratio / count - 1)).toBeLessThan(0.1);
  });

  it('random-walk FM h₋₂/f²: log-log slope −2 ± 0.1 from 0.1 Hz to fs/10', () => {
    const s = logFrequencyOf({ sampleRateHz: fs, output: 'frequency', randomWalkHz3: 20, seed: 4 }, n);
    expect(Math.abs(logLogSlope(s, 0.1, 100) + 2)).toBeLessThan(0.1);
  });

  it('the flicker bank PSD (exact, discrete) is h/f within −1 %…+0.3 % from lowestHz to fs/10', () => {
    const poles = flickerPoles(1e6, 7, 10);
    for (let f = 10; f <= 1e5; f *= 1.05) {
      const r = (flickerBankPsd(poles, 1e6, f) * f) / 7;
      expect(r).toBeGreaterThan(0.99);
      expect(r).toBeLessThan(1.003);
    }
    expect((flickerBankPsd(poles, 1e6, 2.5e5) * 2.5e5) / 7).toBeCloseTo(1.04, 2); // +4 % at fs/4, as documented
  });

  it('a spur of peak deviation Δf reads Δf²/2 in power-spectrum scaling (flat-top, off-bin)', () => {
    const nu = synthesize({ sampleRateHz: fs, output: 'frequency', spurs: [{ frequencyHz: 50.3, peakDeviationHz: 10 }] }, 2 ** 16).channels[0];
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 4096, window: 'flat-top', scaling: 'spectrum' });
    const m = Math.round((50.3 * 4096) / fs);
    expect(Math.abs(Math.max(s.psd[m - 1], s.psd[m], s.psd[m + 1]) / 50 - 1)).toBeLessThan(2e-3);
  });

  it('a spur given by its S_ν height and RBW reads that height in a Welch density with that ENBW', () => {
    const enbw = (1.5 * fs) / 1000; // Hann, L = 1000
    const nu = synthesize(
      { sampleRateHz: fs, output: 'frequency', spurs: [{ frequencyHz: 50, heightHz2PerHz: 200, rbwHz: enbw }] },
      20000,
    ).channels[0];
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 1000 });
    expect(s.psd[50]).toBeCloseTo(200, 6);
  });

  it('a bump has the requested peak (exact model) and the generated S_ν follows resonancePsd near it', () => {
    const bump = { centerHz: 100, widthHz: 8, peakHz2PerHz: 40 };
    const c = resonanceCoefficients({ sampleRateHz: fs, ...bump });
    expect(resonancePsd(c, fs, 100)).toBeCloseTo(40, 10);
    expect(resonancePsd(c, fs, 104) / 40).toBeGreaterThan(0.4); // −3 dB full width ≈ W
    expect(resonancePsd(c, fs, 104) / 40).toBeLessThan(0.6);
    const nu = synthesize({ sampleRateHz: fs, output: 'frequency', bumps: [bump], seed: 6 }, 2 ** 20).channels[0];
    const s = welch(nu, { sampleRateHz: fs, segmentLength: 4096 });
    let got = 0;
    let want = 0;
    for (let m = 0; m < s.psd.length; m++) {
      if (Math.abs(s.frequencyHz[m] - 100) <= 2) {
        got += s.psd[m];
        want += resonancePsd(c, fs, s.frequencyHz[m]);
      }
    }
    expect(Math.abs(got / want - 1)).toBeLessThan(0.06);
  });
});

describe('createSynthGenerator outputs', () => {
  it('same seed and options give the same samples whatever the block sizes; another seed differs', () => {
    const options: SynthOptions = {
      sampleRateHz: 1e4,
      output: 'iq',
      whiteHz2PerHz: 10,
      flickerHz2: 100,
      randomWalkHz3: 5,
      spurs: [{ frequencyHz: 50, peakDeviationHz: 3 }],
      bumps: [{ centerHz: 900, widthHz: 40, peakHz2PerHz: 20 }],
      additiveNoiseDensity: 1e-6,
      seed: 42,
    };
    const whole = synthesize(options, 5000);
    const gen = createSynthGenerator(options);
    const parts = [1, 999, 3000, 1000].map((k) => gen.next(k));
    for (const ch of [0, 1]) expect(parts.flatMap((p) => Array.from(p.channels[ch]))).toEqual(Array.from(whole.channels[ch]));
    const other = synthesize({ ...options, seed: 43 }, 5000);
    expect(Array.from(other.channels[0])).not.toEqual(Array.from(whole.channels[0]));
  });

  it("'phase' output differences back to ν exactly: fs/(2π)·(φ[k] − φ[k−1]) = ν[k]", () => {
    const o = { sampleRateHz: 2e3, whiteHz2PerHz: 4, carrierOffsetHz: 37, driftHzPerS: 3, seed: 8 } as const;
    const nu = synthesize({ ...o, output: 'frequency' }, 1000).channels[0];
    const phi = synthesize({ ...o, output: 'phase' }, 1000).channels[0];
    for (let k = 1; k < 1000; k++) expect(((phi[k] - phi[k - 1]) * 2e3) / (2 * Math.PI)).toBeCloseTo(nu[k], 6);
    // carrier offset + drift·t
    expect(nu.reduce((a, b) => a + b, 0) / 1000).toBeCloseTo(37 + 3 * (999 / 2 / 2e3), 0);
  });

  it("'iq' has amplitude A; additive noise of density N0 has variance N0·fs/2 on each channel", () => {
    const clean = synthesize({ sampleRateHz: 1e3, output: 'iq', amplitude: 2.5, whiteHz2PerHz: 1 }, 1000);
    for (let k = 0; k < 1000; k += 37) expect(Math.hypot(clean.channels[0][k], clean.channels[1][k])).toBeCloseTo(2.5, 12);
    const noisy = synthesize({ sampleRateHz: 1e3, output: 'iq', amplitude: 1e-9, additiveNoiseDensity: 2e-3 }, 200000);
    for (const ch of noisy.channels) {
      const v = ch.reduce((a, x) => a + x * x, 0) / ch.length;
      expect(Math.abs(v / 1 - 1)).toBeLessThan(0.01); // N0·fs/2 = 1
    }
  });

  it("'beat' is A·cos(2π f_IF t + φ): a quiet carrier puts its power A²/2 at f_IF", () => {
    const v = synthesize({ sampleRateHz: 1e4, output: 'beat', amplitude: 3, intermediateFrequencyHz: 1250 }, 8192).channels[0];
    const s = welch(v, { sampleRateHz: 1e4, segmentLength: 8192, scaling: 'spectrum' });
    expect(s.psd[Math.round((1250 * 8192) / 1e4)]).toBeCloseTo(4.5, 9);
  });
});

describe('synthetic-capture options', () => {
  const base = { sampleRateHz: 1000, output: 'frequency' } as const;
  it.each([
    [{ ...base, sampleRateHz: -1 }, /sampleRateHz/],
    [{ ...base, output: 'voltage' }, /output must be one of/],
    [{ ...base, seed: -3 }, /seed/],
    [{ ...base, whiteHz2PerHz: -1 }, /whiteHz2PerHz/],
    [{ ...base, flickerHz2: Number.NaN }, /flickerHz2/],
    [{ ...base, randomWalkHz3: -2 }, /randomWalkHz3/],
    [{ ...base, flickerLowestHz: 100 }, /flickerLowestHz/],
    [{ ...base, spurs: [{ frequencyHz: 600, peakDeviationHz: 1 }] }, /spurs\[0\]\.frequencyHz/],
    [{ ...base, spurs: [{ frequencyHz: 60 }] }, /peakDeviationHz or heightHz2PerHz/],
    [{ ...base, spurs: [{ frequencyHz: 60, peakDeviationHz: 1, heightHz2PerHz: 1, rbwHz: 1 }] }, /not both/],
    [{ ...base, spurs: [{ frequencyHz: 60, heightHz2PerHz: 1 }] }, /needs rbwHz/],
    [{ ...base, bumps: [{ centerHz: 100, widthHz: 200, peakHz2PerHz: 1 }] }, /widthHz/],
    [{ ...base, bumps: [{ centerHz: 100, widthHz: 2, peakHz2PerHz: 0 }] }, /peakHz2PerHz/],
    [{ ...base, bumps: [{ centerHz: 700, widthHz: 2, peakHz2PerHz: 1 }] }, /centerHz/],
    [{ ...base, amplitude: 0 }, /amplitude/],
    [{ ...base, output: 'beat', intermediateFrequencyHz: 500 }, /intermediateFrequencyHz/],
    [{ ...base, output: 'iq', intermediateFrequencyHz: 100 }, /output 'beat' only/],
    [{ ...base, additiveNoiseDensity: -1 }, /additiveNoiseDensity/],
    [{ ...base, carrierOffsetHz: Infinity }, /carrierOffsetHz/],
  ])('rejects %o', (options, message) => {
    expect(() => createSynthGenerator(options as never)).toThrow(AnalysisInputError);
    expect(() => createSynthGenerator(options as never)).toThrow(message);
  });

  it('rejects a bad block size', () => {
    const g = createSynthGenerator(base);
    expect(() => g.next(-1)).toThrow(/block size/);
    expect(() => g.next(2.5)).toThrow(/block size/);
  });
});
