import { describe, expect, it } from 'vitest';

import { correctDelayInterferometer, delayInterferometerGain } from '../../analysis/corrections/delay-interferometer';
import { BIN_NOT_POSITIVE, BIN_OUTSIDE_REFERENCE, subtractReference } from '../../analysis/corrections/reference-subtraction';
import { AnalysisInputError } from '../../analysis/errors';
import { welch } from '../../analysis/spectrum/welch';
import { createSynthGenerator } from '../../analysis/synth/generator';
import type { Spectrum } from '../../analysis/types';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

function grid(lo: number, hi: number, n: number, fn: (f: number) => number): Spectrum {
  const frequencyHz = new Float64Array(n);
  const psd = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    frequencyHz[i] = lo + ((hi - lo) * i) / (n - 1);
    psd[i] = fn(frequencyHz[i]);
  }
  return { frequencyHz, psd };
}

describe('subtractReference(beat, reference): S_ν,test = S_ν,beat − S_ν,ref (METHODS 4.1)', () => {
  it('h₀ 1e4 (test) + 5e3 (reference) beat at 1.5e4; a reference linewidth π·5e3 Hz (white level Δν/π) leaves 1e4', () => {
    const beat = grid(10, 1e5, 100, () => 1.5e4);
    const r = subtractReference(beat, { linewidthHz: Math.PI * 5e3 });
    expect(r.method).toBe('white-level');
    for (const v of r.spectrum.psd) expect(v).toBeCloseTo(1e4, 8);
    expect(r.notPositiveCount).toBe(0);
    expect(r.warnings).toEqual([]);
  });

  it('a reference spectrum is read on the beat grid (power law between its points): beat 1e4 + 1e6/f minus reference 1e6/f on a coarser grid → 1e4', () => {
    const beat = grid(100, 1e4, 199, (f) => 1e4 + 1e6 / f);
    const refF = Float64Array.from([50, 500, 5000, 20000]);
    const reference = { frequencyHz: refF, psd: refF.map((f) => 1e6 / f) };
    const r = subtractReference(beat, { spectrum: reference });
    expect(r.method).toBe('spectrum');
    for (const v of r.spectrum.psd) expect(rel(v, 1e4)).toBeLessThan(1e-9);
  });

  it('bins going to or below zero are flagged (status 1), left out of the spectrum and named in a warning', () => {
    const beat = grid(1, 10, 10, (f) => (f < 4 ? 100 : 1));
    const r = subtractReference(beat, { linewidthHz: Math.PI * 10 }); // reference white level 10
    expect(r.notPositiveCount).toBe(7);
    expect(Array.from(r.status)).toEqual([0, 0, 0, 1, 1, 1, 1, 1, 1, 1].map((s) => (s ? BIN_NOT_POSITIVE : 0)));
    expect(r.spectrum.frequencyHz.length).toBe(3);
    expect(r.frequencyNoiseHz2PerHz[5]).toBe(0);
    expect(r.warnings.join(' ')).toMatch(/7 bin\(s\) went to or below zero/);
    expect(r.warnings.join(' ')).toMatch(/more than half the beat/);
  });

  it('bins outside the reference grid are flagged (status 2), not extrapolated', () => {
    const beat = grid(1, 100, 100, () => 10);
    const reference = grid(10, 50, 5, () => 1);
    const r = subtractReference(beat, { spectrum: reference });
    expect(r.outsideReferenceCount).toBe(59);
    expect(r.status[0]).toBe(BIN_OUTSIDE_REFERENCE);
    expect(r.spectrum.frequencyHz[0]).toBe(10);
    expect(r.spectrum.psd[0]).toBe(9);
  });

  it('two identical lasers: each has half the beat S_ν (METHODS 4.1)', () => {
    const r = subtractReference(grid(1, 10, 4, () => 8), { identical: true });
    expect(Array.from(r.spectrum.psd)).toEqual([4, 4, 4, 4]);
  });

  it('rejects a bad reference', () => {
    const beat = grid(1, 10, 4, () => 8);
    expect(() => subtractReference(beat, { linewidthHz: -1 })).toThrow(/reference linewidth/);
    expect(() => subtractReference(beat, {} as never)).toThrow(AnalysisInputError);
    expect(() => subtractReference(beat, { spectrum: { frequencyHz: new Float64Array(1), psd: new Float64Array(1) } })).toThrow(/at least 2 points/);
  });
});

describe('correctDelayInterferometer(S_Δφ, { delayS }): S_ν = f²S_Δφ/(4 sin²(πfτ)) (METHODS 4.3)', () => {
  it('exact inverse on an analytic spectrum: S_ν = 1e4 + 1e7/f comes back to 1e-12 in every unmasked bin', () => {
    const tau = 5e-6;
    const model = (f: number) => 1e4 + 1e7 / f;
    const sdphi = grid(0, 1e6, 2001, (f) => (f === 0 ? 0 : (delayInterferometerGain(f, tau) * model(f)) / (f * f)));
    const r = correctDelayInterferometer(sdphi, { delayS: tau });
    r.spectrum.frequencyHz.forEach((f, i) => expect(rel(r.spectrum.psd[i], model(f))).toBeLessThan(1e-12));
    expect(r.firstZeroHz).toBeCloseTo(2e5, 6);
    expect(r.discriminatorSlopeRadPerHz).toBeCloseTo(2 * Math.PI * 5e-6, 15);
  });

  it('masks the bins with 4 sin²(πfτ) < 0.1 near the zeros n/τ, n ≥ 1 (|fτ − n| < 0.0506), and f = 0, reporting them as ranges', () => {
    const tau = 1e-3; // zeros at 0, 1, 2 kHz
    const r = correctDelayInterferometer(grid(0, 2500, 2501, () => 1), { delayS: tau });
    // |f − n·1000| < 50.6 Hz for n ≥ 1 → 950…1050, 1950…2050 (1 Hz grid); near n = 0 only f = 0 (the correction is finite there)
    expect(r.maskedRangesHz).toEqual([
      [0, 0],
      [950, 1050],
      [1950, 2050],
    ]);
    expect(r.maskedCount).toBe(1 + 101 + 101);
    expect(r.masked[10]).toBe(0);
    expect(r.masked[1000]).toBe(1);
    expect(r.frequencyNoiseHz2PerHz[1000]).toBe(0);
    expect(r.warnings.join(' ')).toMatch(/0\.9\/τ/);
  });

  it('the low-f limit is S_Δφ/(2πτ)²', () => {
    const tau = 1e-6;
    const r = correctDelayInterferometer(grid(1, 100, 100, () => 2), { delayS: tau });
    expect(rel(r.spectrum.psd[0], 2 / (2 * Math.PI * tau) ** 2)).toBeLessThan(1e-8);
  });

  it('a simulated discriminator (white + flicker FM, τ = 50 µs): recovered S_ν within 2 % of the directly measured f²S_φ off the zeros (METHODS 9 row 10)', () => {
    const fs = 1e6;
    const d = 50; // τ = 50 µs: zeros at 20 kHz, 40 kHz, …
    const n = 1 << 20;
    const phi = createSynthGenerator({ sampleRateHz: fs, output: 'phase', whiteHz2PerHz: 1e4, flickerHz2: 1e8, seed: 8 }).next(n + d).channels[0];
    const dphi = new Float64Array(n);
    for (let k = 0; k < n; k++) dphi[k] = phi[k + d] - phi[k]; // Δφ(t) = φ(t) − φ(t − τ)
    const opts = { sampleRateHz: fs, segmentLength: 4096, detrend: 'linear' as const };
    const sDphi = welch(dphi, opts);
    const sPhi = welch(phi.subarray(d), opts);
    const r = correctDelayInterferometer(sDphi, { delayS: d / fs });
    // compare with f²·S_φ from the same record (an independent estimate of S_ν), 1 kHz … 100 kHz
    const ratios: number[] = [];
    const bands = new Map<number, { sum: number; count: number }>();
    for (let i = 0; i < sDphi.frequencyHz.length; i++) {
      const f = sDphi.frequencyHz[i];
      if (r.masked[i] || f < 1e3 || f > 1e5) continue;
      const ratio = r.frequencyNoiseHz2PerHz[i] / (f * f * sPhi.psd[i]);
      ratios.push(ratio);
      const band = Math.floor((f * d) / fs); // between zeros n/τ and (n+1)/τ
      const b = bands.get(band) ?? { sum: 0, count: 0 };
      b.sum += ratio;
      b.count++;
      bands.set(band, b);
    }
    ratios.sort((a, b) => a - b);
    expect(Math.abs(ratios[Math.floor(ratios.length / 2)] - 1)).toBeLessThan(0.02);
    expect(bands.size).toBe(5); // 1–20, 20–40, 40–60, 60–80, 80–100 kHz
    for (const b of bands.values()) expect(Math.abs(b.sum / b.count - 1)).toBeLessThan(0.02);
  });

  it('rejects bad input', () => {
    const s = grid(0, 10, 11, () => 1);
    expect(() => correctDelayInterferometer(s, { delayS: 0 })).toThrow(/delay must be a positive/);
    expect(() => correctDelayInterferometer(s, { delayS: 1, maskThreshold: 5 })).toThrow(/maskThreshold/);
    expect(() => correctDelayInterferometer({ frequencyHz: Float64Array.of(0, 2, 1), psd: Float64Array.of(1, 1, 1) }, { delayS: 1 })).toThrow(/increase/);
  });
});
