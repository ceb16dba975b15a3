import { readFileSync } from 'node:fs';

import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { fitRfLine } from '../../analysis/rf/line-fit';
import { gaussianShape, lorentzianShape } from '../../analysis/rf/line-shapes';
import { dshBeatFwhm, dshBeatSpectrum, selfHeterodyneLinewidth } from '../../analysis/rf/self-heterodyne';
import { twentyDbWidth } from '../../analysis/rf/twenty-db-width';
import { voigtFwhmOliveroLongbothum } from '../../analysis/rf/voigt-width';
import { createSynthGenerator } from '../../analysis/synth/generator';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const fixture = JSON.parse(readFileSync(new URL('../fixtures/rf/rf-reference.json', import.meta.url), 'utf8')) as {
  selfHeterodyne: { product: number; ratio: number; carrierFraction: number }[];
};

describe('dshBeatFwhm(Δν, τ_d): the white-FM self-heterodyne beat (METHODS 4.2, Richter et al. 1986 form)', () => {
  it('ratio FWHM/(2Δν): 1.775 at τ_dΔν = 0.3, 1.253 at 0.5, 1.080 at 0.7, 1.012 at 1.0, 1.0000 at 2 (METHODS 4.2 table)', () => {
    const table: [number, number, number][] = [
      [0.3, 1.775, 5e-4],
      [0.5, 1.253, 5e-4],
      [0.7, 1.08, 5e-4],
      [1.0, 1.012, 5e-4],
      [2.0, 1.0, 5e-5],
    ];
    const dnu = 1e4;
    for (const [p, ratio, tol] of table) expect(Math.abs(dshBeatFwhm(dnu, p / dnu) / (2 * dnu) - ratio)).toBeLessThan(tol);
  });

  it('matches scipy brentq on the same closed form to 1e-9 (tests/fixtures/rf/make-rf-fixture.py)', () => {
    for (const row of fixture.selfHeterodyne) expect(rel(dshBeatFwhm(1e4, row.product / 1e4) / 2e4, row.ratio)).toBeLessThan(1e-9);
  });

  it('the f → 0 limit is continuous with the general expression (series for small 2πΔντ)', () => {
    for (const p of [1e-4, 0.01, 1]) {
      expect(rel(dshBeatSpectrum(1e-6, 1, p), dshBeatSpectrum(0, 1, p))).toBeLessThan(1e-6);
    }
  });

  it('long delay: the continuous part is the Lorentzian of FWHM 2Δν with unit area, Δν/(π(Δν² + f²))·… → 1/(πΔν) at f = 0', () => {
    expect(rel(dshBeatSpectrum(0, 1e3, 1), 1 / (Math.PI * 1e3))).toBeLessThan(1e-12);
  });
});

describe('selfHeterodyneLinewidth(input) states its assumption', () => {
  it('Lorentzian beat 62.832 kHz with 25 km of fibre → Δν = 31.416 kHz; τ_d = 1.468·25e3/c = 122.4 µs, τ_dΔν = 3.85, no warning', () => {
    const r = selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: 62832, fiberLengthM: 25e3 });
    expect(r.laserLinewidthHz).toBe(31416);
    expect(r.assumption).toMatch(/delay long against the coherence time/);
    expect(r.assumption).toMatch(/half the beat width/);
    expect(r.delayS as number).toBeCloseTo((1.468 * 25e3) / 299792458, 15);
    expect(r.delayLinewidthProduct as number).toBeCloseTo(3.846, 3);
    expect(r.warnings).toEqual([]);
  });

  it('a delay shorter than the coherence time (τ_dΔν = 0.5) warns, and the closed form gives back Δν from the beat', () => {
    const dnu = 1e4;
    const tau = 0.5 / dnu;
    const beat = dshBeatFwhm(dnu, tau); // 1.253 × 2Δν
    const r = selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: beat, delayS: tau });
    expect(r.warnings.join(' ')).toMatch(/delay is too short/);
    expect(rel(r.shortDelayLinewidthHz as number, dnu)).toBeLessThan(1e-8);
    expect(r.laserLinewidthHz).toBeCloseTo(1.2529 * dnu, -1);
  });

  it('a beat narrower than the delay allows (0.886/τ_d) is called resolution-limited', () => {
    const r = selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: 0.5, delayS: 1 });
    expect(r.shortDelayLinewidthHz).toBeNull();
    expect(r.warnings.join(' ')).toMatch(/resolution-limited/);
  });

  it('Gaussian: laser = beat/√2; Voigt: f_L = beat_L/2, f_G = beat_G/√2, laser FWHM by Olivero & Longbothum', () => {
    expect(selfHeterodyneLinewidth({ shape: 'gaussian', beatFwhmHz: 2 }).laserLinewidthHz).toBeCloseTo(Math.SQRT2, 14);
    const v = selfHeterodyneLinewidth({ shape: 'voigt', beatLorentzianFwhmHz: 2e4, beatGaussianFwhmHz: 3e4, delayS: 1e-3 });
    expect(v.laserLorentzianFwhmHz).toBe(1e4);
    expect(v.laserGaussianFwhmHz as number).toBeCloseTo(3e4 / Math.SQRT2, 8);
    expect(v.laserLinewidthHz).toBeCloseTo(voigtFwhmOliveroLongbothum(1e4, 3e4 / Math.SQRT2), 8);
    expect(v.delayLinewidthProduct).toBeCloseTo(10, 10);
  });

  it('without a delay the assumption cannot be checked, and says so', () => {
    expect(selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: 1e3 }).warnings.join(' ')).toMatch(/no delay given/);
  });

  it('rejects bad input', () => {
    expect(() => selfHeterodyneLinewidth({ shape: 'sinc' as never, beatFwhmHz: 1 })).toThrow(AnalysisInputError);
    expect(() => selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: -1 })).toThrow(/beatFwhmHz/);
    expect(() => selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: 1, delayS: 1, fiberLengthM: 1 })).toThrow(/not both/);
    expect(() => selfHeterodyneLinewidth({ shape: 'voigt', beatLorentzianFwhmHz: 1 })).toThrow(/Voigt beat needs/);
  });
});

describe('a simulated self-heterodyne measurement (METHODS 9 row 9: white FM, τ_dΔν = 1.57 → beat 2πh0 within 1 %)', () => {
  it('h0 = 1e4, fs = 2 MHz, τ_d = 50 µs: Welch spectrum of exp(i(φ(t) − φ(t − τ_d))), Lorentzian fit → 62832 Hz ± 1 %, Δν = 31416 Hz ± 1 %', () => {
    const fs = 2e6;
    const d = 100; // τ_d = 50 µs
    const L = 4096;
    // 2000 segments (2 s of record): over seeds the fitted width scatters by ≈ 0.35 % here, so 1 % is ~3σ
    const K = 2000;
    const n = (K + 1) * (L / 2) + d;
    const phi = createSynthGenerator({ sampleRateHz: fs, output: 'phase', whiteHz2PerHz: 1e4, seed: 21 }).next(n).channels[0];
    const fft = new FFT(L);
    const input = fft.createComplexArray() as number[];
    const out = fft.createComplexArray() as number[];
    const acc = new Float64Array(L);
    for (let k = 0; k < K; k++) {
      const start = d + (k * L) / 2;
      for (let j = 0; j < L; j++) {
        const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * j) / L); // periodic Hann
        const dp = phi[start + j] - phi[start + j - d];
        input[2 * j] = w * Math.cos(dp);
        input[2 * j + 1] = w * Math.sin(dp);
      }
      fft.transform(out, input);
      for (let j = 0; j < L; j++) acc[j] += out[2 * j] ** 2 + out[2 * j + 1] ** 2;
    }
    // two-sided spectrum centred on 0, kept within ±250 kHz
    const f: number[] = [];
    const p: number[] = [];
    for (let j = -L / 2 + 1; j < L / 2; j++) {
      const hz = (j * fs) / L;
      if (Math.abs(hz) <= 2.5e5) {
        f.push(hz);
        p.push(acc[(j + L) % L] / K);
      }
    }
    const fit = fitRfLine({ frequencyHz: Float64Array.from(f), powerMw: Float64Array.from(p) }, 'lorentzian');
    expect(rel(fit.fwhmHz, 2 * Math.PI * 1e4)).toBeLessThan(0.01);
    const r = selfHeterodyneLinewidth({ shape: 'lorentzian', beatFwhmHz: fit.fwhmHz, delayS: d / fs });
    expect(rel(r.laserLinewidthHz, Math.PI * 1e4)).toBeLessThan(0.01);
    expect(r.delayLinewidthProduct as number).toBeGreaterThan(1.5);
  });
});

describe('twentyDbWidth(spectrum): the −20 dB method (METHODS 4.2)', () => {
  const grid = (fn: (x: number) => number) => {
    const n = 20001;
    const f = new Float64Array(n);
    const p = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      f[i] = -50e3 + (100e3 * i) / (n - 1);
      p[i] = fn(f[i]);
    }
    return { frequencyHz: f, powerMw: p };
  };

  it('Lorentzian FWHM 1 kHz on a −80 dB floor: W₋₂₀ = √99 × 1 kHz = 9.950 kHz, FWHM back to 1e-3', () => {
    const r = twentyDbWidth(grid((x) => 1e-3 * (lorentzianShape(x, 1e3) + 1e-8)));
    expect(rel(r.widthHz, Math.sqrt(99) * 1e3)).toBeLessThan(1e-3);
    expect(rel(r.lorentzianFwhmHz, 1e3)).toBeLessThan(1e-3);
    expect(r.warnings).toEqual([]);
  });

  it('Gaussian FWHM 3 kHz: W₋₂₀ = √(ln100/ln2) × 3 kHz = 7.734 kHz, FWHM back to 1e-3', () => {
    const r = twentyDbWidth(grid((x) => gaussianShape(x, 3e3) + 1e-9));
    expect(rel(r.widthHz, 2.578 * 3e3)).toBeLessThan(1e-3);
    expect(rel(r.gaussianFwhmHz, 3e3)).toBeLessThan(1e-3);
  });

  it('warns when the floor is less than 30 dB down', () => {
    const r = twentyDbWidth(grid((x) => lorentzianShape(x, 1e3) + 2e-3));
    expect(r.warnings.join(' ')).toMatch(/floor is only/);
  });

  it('a spectrum that never falls 20 dB on one side is an error naming the side', () => {
    expect(() => twentyDbWidth(grid((x) => (x < 0 ? 1 : lorentzianShape(x, 1e3))))).toThrow(/low-frequency side/);
  });

  it('rejects too few points and negative powers', () => {
    expect(() => twentyDbWidth({ frequencyHz: Float64Array.of(1, 2, 3), powerMw: Float64Array.of(1, 2, 1) })).toThrow(/at least 5/);
    expect(() => twentyDbWidth({ frequencyHz: Float64Array.of(1, 2, 3, 4, 5), powerMw: Float64Array.of(1, -2, 1, 1, 1) })).toThrow(/>= 0/);
  });
});
