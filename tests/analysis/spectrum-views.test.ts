import { describe, expect, it } from 'vitest';
import { correctFiniteDifference, finiteDifferenceGain } from '../../analysis/spectrum/finite-difference-correction';
import { logBinSpectrum } from '../../analysis/spectrum/log-binning';
import { spectrumView, ssbPhaseNoiseDbcFromFrequencyNoise } from '../../analysis/spectrum/views';

describe('spectrumView (S_ν → S_φ, L(f), √S_ν)', () => {
  it('white FM h0 = 1e4 Hz²/Hz at 1 MHz: S_φ = 1e-8 rad²/Hz and L = −83.01 dBc/Hz (IEEE Std 1139; METHODS 2.5)', () => {
    const s = { frequencyHz: Float64Array.of(0, 1e6), psd: Float64Array.of(1e4, 1e4) };
    const phi = spectrumView(s, 'phase-noise');
    expect(phi.unit).toBe('rad²/Hz');
    expect(Array.from(phi.frequencyHz)).toEqual([1e6]); // f = 0 dropped
    expect(phi.values[0]).toBeCloseTo(1e-8, 20);
    const L = spectrumView(s, 'ssb-phase-noise');
    expect(L.unit).toBe('dBc/Hz');
    expect(L.values[0]).toBeCloseTo(-83.0103, 4); // 10·log10(0.5e-8)
    expect(ssbPhaseNoiseDbcFromFrequencyNoise(1e4, 1e6)).toBeCloseTo(-83.01, 2);
  });

  it("'frequency-noise-asd' is √S_ν in Hz/√Hz and keeps f = 0", () => {
    const v = spectrumView({ frequencyHz: Float64Array.of(0, 10), psd: Float64Array.of(4, 9) }, 'frequency-noise-asd');
    expect(Array.from(v.values)).toEqual([2, 3]);
    expect(v.unit).toBe('Hz/√Hz');
  });

  it("'frequency-noise' passes S_ν through", () => {
    const v = spectrumView({ frequencyHz: Float64Array.of(1, 2), psd: Float64Array.of(5, 6) }, 'frequency-noise');
    expect(Array.from(v.values)).toEqual([5, 6]);
  });

  it('rejects an unknown view and mismatched lengths', () => {
    const s = { frequencyHz: Float64Array.of(1), psd: Float64Array.of(1) };
    expect(() => spectrumView(s, 'allan' as never)).toThrow(/view must be one of/);
    expect(() => spectrumView({ frequencyHz: Float64Array.of(1, 2), psd: Float64Array.of(1) }, 'phase-noise')).toThrow(/lengths differ/);
  });
});

describe('finiteDifferenceGain / correctFiniteDifference (METHODS 2.4)', () => {
  it.each([
    [0.01, 1.00033, 1e-5],
    [0.1, 1.0336, 1e-4],
    [0.25, 1.2337, 1e-5],
    [0.5, 2.4674, 1e-4],
  ])('1/sinc²(f/fs) at f/fs = %f is %f', (x, want, tol) => {
    expect(Math.abs(1 / finiteDifferenceGain(x * 1e6, 1e6) - want)).toBeLessThan(tol);
  });

  it('1/sinc² at f/fs = 0.25 is π²/8 = 1.23370 (METHODS 9 #5, tolerance 1e-5)', () => {
    expect(Math.abs(1 / finiteDifferenceGain(250, 1000) - 1.2337)).toBeLessThan(1e-5);
    expect(1 / finiteDifferenceGain(250, 1000)).toBeCloseTo(Math.PI ** 2 / 8, 14);
  });

  it('correctFiniteDifference divides each bin by sinc²(f/fs) and leaves DC alone', () => {
    const c = correctFiniteDifference({ frequencyHz: Float64Array.of(0, 250, 500), psd: Float64Array.of(1, 1, 1) }, 1000);
    expect(c.psd[0]).toBe(1);
    expect(c.psd[1]).toBeCloseTo(Math.PI ** 2 / 8, 14);
    expect(c.psd[2]).toBeCloseTo(Math.PI ** 2 / 4, 14);
  });

  it('correctFiniteDifference rejects a frequency above fs/2 and a bad fs', () => {
    const s = { frequencyHz: Float64Array.of(600), psd: Float64Array.of(1) };
    expect(() => correctFiniteDifference(s, 1000)).toThrow(/above fs\/2/);
    expect(() => correctFiniteDifference(s, 0)).toThrow(/sampleRateHz/);
  });
});

describe('logBinSpectrum (display binning)', () => {
  const f = Float64Array.from({ length: 1001 }, (_, i) => i); // 0..1000 Hz
  it('a flat PSD stays flat; counts add up to the points with f > 0; sparse low bins pass points through', () => {
    const d = logBinSpectrum({ frequencyHz: f, psd: new Float64Array(1001).fill(2) }, { pointsPerDecade: 10 });
    expect(Array.from(d.psd).every((v) => v === 2)).toBe(true);
    expect(Array.from(d.counts).reduce((a, b) => a + b, 0)).toBe(1000);
    expect(Array.from(d.frequencyHz.slice(0, 4))).toEqual([1, 2, 3, 4.5]); // 4 and 5 share the bin [3.98, 5.01)
    expect(d.frequencyHz.length).toBeLessThanOrEqual(31);
  });

  it('averages linear values, not dB: [1, 100] in one bin gives 50.5', () => {
    const d = logBinSpectrum({ frequencyHz: Float64Array.of(100, 101), psd: Float64Array.of(1, 100) }, { pointsPerDecade: 10 });
    expect(Array.from(d.psd)).toEqual([50.5]);
    expect(Array.from(d.frequencyHz)).toEqual([100.5]);
  });

  it('{ points: n } gives about n points over the decades present', () => {
    const d = logBinSpectrum({ frequencyHz: f, psd: new Float64Array(1001).fill(1) }, { points: 12 });
    expect(d.frequencyHz.length).toBeLessThanOrEqual(13);
    expect(d.frequencyHz.length).toBeGreaterThanOrEqual(9);
  });

  it('rejects both options together, bad counts, descending frequencies', () => {
    const s = { frequencyHz: Float64Array.of(1, 2), psd: Float64Array.of(1, 1) };
    expect(() => logBinSpectrum(s, { points: 3, pointsPerDecade: 3 })).toThrow(/not both/);
    expect(() => logBinSpectrum(s, { points: 0 })).toThrow(/points/);
    expect(() => logBinSpectrum(s, { pointsPerDecade: -1 })).toThrow(/pointsPerDecade/);
    expect(() => logBinSpectrum({ frequencyHz: Float64Array.of(2, 1), psd: Float64Array.of(1, 1) })).toThrow(/ascending/);
  });
});
