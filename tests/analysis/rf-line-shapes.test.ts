import { readFileSync } from 'node:fs';

import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { faddeeva } from '../../analysis/rf/faddeeva';
import { gaussianShape, lorentzianShape, voigtProfile, voigtShape } from '../../analysis/rf/line-shapes';
import {
  voigtFwhmExact,
  voigtFwhmOliveroLongbothum,
  voigtFwhmOliveroLongbothumGradient,
  voigtFwhmThompsonCoxHastings,
} from '../../analysis/rf/voigt-width';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const fixture = JSON.parse(readFileSync(new URL('../fixtures/rf/rf-reference.json', import.meta.url), 'utf8')) as {
  wofz: [number, number, number, number][];
  voigtProfile: [number, number, number, number][];
  voigtFwhm: [number, number, number][];
};

describe('faddeeva(x, y) (Weideman 1994) against scipy.special.wofz (tests/fixtures/rf/make-rf-fixture.py)', () => {
  it('|Δw| < 1e-13·|w| + 1e-15 over 120 points of the upper half plane', () => {
    for (const [x, y, re, im] of fixture.wofz) {
      const w = faddeeva(x, y);
      const err = Math.hypot(w.re - re, w.im - im);
      expect(err).toBeLessThan(1e-13 * Math.hypot(re, im) + 1e-15);
    }
  });

  it('w(i) = e·erfc(1) = 0.42758357615580705 (a closed form), and w(0) = 1', () => {
    const w = faddeeva(0, 1);
    expect(w.re).toBeCloseTo(0.42758357615580705, 14);
    expect(Math.abs(w.im)).toBeLessThan(1e-15);
    expect(faddeeva(0, 0).re).toBeCloseTo(1, 14);
  });

  it('symmetry w(−x + iy) = conj(w(x + iy))', () => {
    const a = faddeeva(1.3, 0.4);
    const b = faddeeva(-1.3, 0.4);
    expect(b.re).toBeCloseTo(a.re, 14);
    expect(b.im).toBeCloseTo(-a.im, 14);
  });

  it('rejects Im z < 0', () => expect(() => faddeeva(1, -0.1)).toThrow(AnalysisInputError));
});

describe('line shapes (METHODS 4.4)', () => {
  it('voigtProfile matches scipy.special.voigt_profile to 1e-12', () => {
    for (const [x, sigma, gamma, v] of fixture.voigtProfile) expect(rel(voigtProfile(x, sigma, gamma), v)).toBeLessThan(1e-12);
  });

  it('each peak-normalised shape is 1 at the centre and ½ at ±FWHM/2', () => {
    expect(lorentzianShape(0, 3)).toBe(1);
    expect(lorentzianShape(1.5, 3)).toBeCloseTo(0.5, 15);
    expect(gaussianShape(-1.5, 3)).toBeCloseTo(0.5, 15);
    const fv = voigtFwhmExact(2, 1);
    expect(voigtShape(0, 2, 1)).toBeCloseTo(1, 15);
    expect(voigtShape(fv / 2, 2, 1)).toBeCloseTo(0.5, 12);
  });

  it('the Voigt line tends to its pure limits (f_G → 0: Lorentzian; f_L → 0: Gaussian)', () => {
    expect(voigtShape(0.7, 1, 0)).toBe(lorentzianShape(0.7, 1));
    expect(voigtShape(0.7, 0, 1)).toBe(gaussianShape(0.7, 1));
    expect(Math.abs(voigtShape(0.7, 1, 1e-6) - lorentzianShape(0.7, 1))).toBeLessThan(1e-9);
  });

  it('voigtProfile integrates to 1 (area normalisation)', () => {
    // trapezoid on [−2000, 2000] with σ = 0.6, γ = 0.4; the Lorentzian tails beyond hold 2γ/(π·2000) = 1.27e-4
    let s = 0;
    const h = 0.01;
    for (let x = -2000; x <= 2000; x += h) s += voigtProfile(x, 0.6, 0.4) * h;
    expect(Math.abs(s + (2 * 0.4) / (Math.PI * 2000) - 1)).toBeLessThan(1e-5);
  });
});

describe('Voigt FWHM (Olivero & Longbothum, JQSRT 17, 233 (1977))', () => {
  it('f_L = f_G = 1: exact 1.637595 (Faddeeva + root), OL 1.637596, TCH 1.634643 (METHODS 4.4 / row 11)', () => {
    expect(Math.abs(voigtFwhmExact(1, 1) - 1.637595)).toBeLessThan(1e-6);
    expect(Math.abs(voigtFwhmOliveroLongbothum(1, 1) - 1.637596)).toBeLessThan(1e-6);
    expect(Math.abs(voigtFwhmThompsonCoxHastings(1, 1) - 1.634643)).toBeLessThan(1e-6);
  });

  it('voigtFwhmExact matches scipy (voigt_profile + brentq) to 1e-10 for f_L/f_G = 0.01 … 100', () => {
    for (const [fl, fg, w] of fixture.voigtFwhm) expect(rel(voigtFwhmExact(fl, fg), w)).toBeLessThan(1e-10);
  });

  it('the OL approximation stays within 2.4e-4 of the exact width (METHODS 4.4 bound) over f_L/f_G = 1e-3 … 1e3', () => {
    for (let e = -3; e <= 3; e += 0.25) {
      const fl = 10 ** e;
      expect(rel(voigtFwhmOliveroLongbothum(fl, 1), voigtFwhmExact(fl, 1))).toBeLessThan(2.4e-4);
    }
  });

  it('pure limits: OL(f_L, 0) = 0.5346 f_L + √0.2166 f_L = 1.000003 f_L; OL(0, f_G) = f_G', () => {
    expect(voigtFwhmOliveroLongbothum(2, 0)).toBeCloseTo(2 * (0.5346 + Math.sqrt(0.2166)), 12);
    expect(voigtFwhmOliveroLongbothum(0, 3)).toBe(3);
  });

  it('the gradient used for uncertainties matches a central difference', () => {
    const [gl, gg] = voigtFwhmOliveroLongbothumGradient(1.2, 0.7);
    const h = 1e-6;
    expect(gl).toBeCloseTo((voigtFwhmOliveroLongbothum(1.2 + h, 0.7) - voigtFwhmOliveroLongbothum(1.2 - h, 0.7)) / (2 * h), 8);
    expect(gg).toBeCloseTo((voigtFwhmOliveroLongbothum(1.2, 0.7 + h) - voigtFwhmOliveroLongbothum(1.2, 0.7 - h)) / (2 * h), 8);
  });

  it('rejects negative or all-zero widths', () => {
    expect(() => voigtFwhmOliveroLongbothum(-1, 1)).toThrow(AnalysisInputError);
    expect(() => voigtFwhmExact(0, 0)).toThrow(/not both 0/);
  });
});
