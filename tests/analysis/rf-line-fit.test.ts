import { readFileSync } from 'node:fs';

import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { fitRfLine, fitRfLines, type RfLineShape } from '../../analysis/rf/line-fit';
import { gaussianShape, lorentzianShape, voigtShape } from '../../analysis/rf/line-shapes';
import { voigtFwhmOliveroLongbothum } from '../../analysis/rf/voigt-width';
import { createGaussian } from '../../analysis/synth/gaussian';
import { createRandom } from '../../analysis/synth/prng';

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const fixture = JSON.parse(readFileSync(new URL('../fixtures/rf/rf-reference.json', import.meta.url), 'utf8')) as {
  frequencyHz: number[];
  spectra: { shape: RfLineShape; truth: number[]; powerMw: number[]; fit: number[]; standardErrors: number[]; residualRmsMw: number }[];
};

describe('fitRfLine against scipy.optimize.curve_fit on the same noisy spectra (tests/fixtures/rf/make-rf-fixture.py)', () => {
  const f = Float64Array.from(fixture.frequencyHz);
  for (const s of fixture.spectra) {
    it(`${s.shape}: parameters to 1e-7, standard errors (Jacobian covariance) to 1e-4, residual to 1e-9`, () => {
      const fit = fitRfLine({ frequencyHz: f, powerMw: Float64Array.from(s.powerMw) }, s.shape);
      const widths = s.shape === 'voigt' ? [fit.lorentzianFwhmHz as number, fit.gaussianFwhmHz as number] : [fit.fwhmHz];
      const widthSe = s.shape === 'voigt' ? [fit.lorentzianFwhmUncertaintyHz as number, fit.gaussianFwhmUncertaintyHz as number] : [fit.fwhmUncertaintyHz];
      const ours = [fit.peakMw, fit.centerHz, ...widths, fit.baselineMw];
      const oursSe = [fit.peakUncertaintyMw, fit.centerUncertaintyHz, ...widthSe, fit.baselineUncertaintyMw];
      ours.forEach((v, i) => expect(Math.abs(v - s.fit[i])).toBeLessThan(1e-7 * Math.abs(s.fit[i]) + 1e-6 * s.standardErrors[i]));
      oursSe.forEach((v, i) => expect(rel(v, s.standardErrors[i])).toBeLessThan(1e-4));
      expect(rel(fit.residualRmsMw, s.residualRmsMw)).toBeLessThan(1e-9);
    });
  }

  it('the Voigt FWHM is reported by Olivero & Longbothum with the exact width beside it', () => {
    const s = fixture.spectra[2];
    const fit = fitRfLine({ frequencyHz: f, powerMw: Float64Array.from(s.powerMw) }, 'voigt');
    expect(fit.fwhmHz).toBeCloseTo(voigtFwhmOliveroLongbothum(fit.lorentzianFwhmHz as number, fit.gaussianFwhmHz as number), 6);
    expect(rel(fit.exactFwhmHz as number, fit.fwhmHz)).toBeLessThan(2.4e-4);
    expect(fit.fwhmUncertaintyHz).toBeGreaterThan(0);
  });
});

interface Problem {
  name: string;
  shape: RfLineShape;
  /** [peak mW, centre Hz, width(s) Hz…, baseline mW] */
  truth: number[];
  /** additive Gaussian noise, mW (0: exact data) */
  noise: number;
  /** perturbed start given to the fit */
  start: { centerHz: number; fwhmHz?: number; lorentzianFwhmHz?: number; gaussianFwhmHz?: number; peakMw: number; baselineMw: number };
  /** allowed |fitted − true| per width, in reported standard errors (noisy) or relative (exact data) */
  tolerance: number;
}

// Known-parameter problems (STYLE 7): data from known parameters on 601 points over 80 ± 1 MHz, a perturbed
// start, recovery within the stated tolerance. Noisy problems: within 4 reported standard errors.
const problems: Problem[] = [
  { name: 'exact Lorentzian', shape: 'lorentzian', truth: [1e-3, 80.0e6, 1e5, 1e-6], noise: 0, start: { centerHz: 80.03e6, fwhmHz: 1.4e5, peakMw: 7e-4, baselineMw: 0 }, tolerance: 1e-6 },
  { name: 'exact Gaussian', shape: 'gaussian', truth: [2e-3, 79.95e6, 3e5, 5e-6], noise: 0, start: { centerHz: 80.05e6, fwhmHz: 2e5, peakMw: 3e-3, baselineMw: 1e-5 }, tolerance: 1e-6 },
  { name: 'exact Voigt fL = fG', shape: 'voigt', truth: [1e-3, 80.01e6, 1e5, 1e5, 0], noise: 0, start: { centerHz: 80.0e6, lorentzianFwhmHz: 1.5e5, gaussianFwhmHz: 0.6e5, peakMw: 1.2e-3, baselineMw: 1e-6 }, tolerance: 1e-6 },
  { name: 'exact Voigt fL = 3 fG', shape: 'voigt', truth: [1e-3, 80.0e6, 1.5e5, 5e4, 2e-6], noise: 0, start: { centerHz: 80.02e6, lorentzianFwhmHz: 1e5, gaussianFwhmHz: 1e5, peakMw: 1e-3, baselineMw: 0 }, tolerance: 1e-6 },
  { name: 'noisy Lorentzian (1 % of the peak)', shape: 'lorentzian', truth: [1e-3, 80.0e6, 2e5, 1e-6], noise: 1e-5, start: { centerHz: 79.98e6, fwhmHz: 3e5, peakMw: 8e-4, baselineMw: 0 }, tolerance: 4 },
  { name: 'noisy Gaussian (2 %)', shape: 'gaussian', truth: [1e-3, 80.1e6, 2.5e5, 0], noise: 2e-5, start: { centerHz: 80.0e6, fwhmHz: 1.5e5, peakMw: 1e-3, baselineMw: 0 }, tolerance: 4 },
  { name: 'noisy Voigt fG = 2 fL (0.5 %)', shape: 'voigt', truth: [1e-3, 80.0e6, 8e4, 1.6e5, 1e-6], noise: 5e-6, start: { centerHz: 80.01e6, lorentzianFwhmHz: 1.2e5, gaussianFwhmHz: 1.2e5, peakMw: 1e-3, baselineMw: 0 }, tolerance: 4 },
];

function makeSpectrum(p: Problem, seed: number) {
  const n = 601;
  const f = new Float64Array(n);
  const y = new Float64Array(n);
  const g = createGaussian(createRandom(seed));
  for (let i = 0; i < n; i++) {
    f[i] = 79e6 + (2e6 * i) / (n - 1);
    const x = f[i] - p.truth[1];
    const shape =
      p.shape === 'lorentzian' ? lorentzianShape(x, p.truth[2]) : p.shape === 'gaussian' ? gaussianShape(x, p.truth[2]) : voigtShape(x, p.truth[2], p.truth[3]);
    y[i] = p.truth[p.truth.length - 1] + p.truth[0] * shape + p.noise * g.next();
  }
  return { frequencyHz: f, powerMw: y };
}

describe('fitRfLine recovers known parameters from a perturbed start (a table of problems)', () => {
  problems.forEach((p, k) => {
    it(`${p.name}`, () => {
      const fit = fitRfLine(makeSpectrum(p, 100 + k), p.shape, { initial: p.start });
      const widths = p.shape === 'voigt' ? [fit.lorentzianFwhmHz as number, fit.gaussianFwhmHz as number] : [fit.fwhmHz];
      const ses = p.shape === 'voigt' ? [fit.lorentzianFwhmUncertaintyHz as number, fit.gaussianFwhmUncertaintyHz as number] : [fit.fwhmUncertaintyHz];
      widths.forEach((w, i) => {
        const truth = p.truth[2 + i];
        if (p.noise === 0) expect(rel(w, truth)).toBeLessThan(p.tolerance);
        else expect(Math.abs(w - truth)).toBeLessThan(p.tolerance * ses[i]);
      });
      if (p.noise === 0) {
        expect(Math.abs(fit.centerHz - p.truth[1])).toBeLessThan(1e-3);
        expect(fit.residualRelative).toBeLessThan(1e-8);
      } else {
        expect(Math.abs(fit.centerHz - p.truth[1])).toBeLessThan(p.tolerance * fit.centerUncertaintyHz);
        // the residual estimates the noise: within 10 % for 601 points
        expect(rel(fit.residualRmsMw, p.noise)).toBeLessThan(0.1);
      }
    });
  });
});

describe('fitRfLines(spectrum) fits the three shapes and names the best', () => {
  it('a Gaussian line: the Gaussian wins over the Lorentzian; the Voigt fit reports it as Gaussian when its Lorentzian part vanishes', () => {
    const p = problems[5];
    const r = fitRfLines(makeSpectrum(p, 7));
    expect(r.fits.map((x) => x.shape)).toEqual(['lorentzian', 'gaussian', 'voigt']);
    expect(r.bestShape).toBe('gaussian');
  });

  it('a Voigt line with comparable parts: the Voigt wins', () => {
    const r = fitRfLines(makeSpectrum(problems[6], 8));
    expect(r.bestShape).toBe('voigt');
  });

  it('warns when the resolution bandwidth is not ≪ the width', () => {
    const r = fitRfLine(makeSpectrum(problems[0], 1), 'lorentzian', { resolutionBandwidthHz: 3e4 });
    expect(r.warnings.join(' ')).toMatch(/resolution bandwidth/);
  });
});

describe('fitRfLine answers a fit it cannot make with AnalysisInputError', () => {
  it('a fit that does not converge within the iterations allowed', () => {
    expect(() => fitRfLine(makeSpectrum(problems[6], 3), 'voigt', { initial: problems[6].start, maxIterations: 1 })).toThrow(/did not converge/);
  });

  it('pure noise (no line): the fit does not converge or finds no line above 3 standard errors', () => {
    const g = createGaussian(createRandom(99));
    const n = 400;
    const f = Float64Array.from({ length: n }, (_, i) => 1e6 + i * 100);
    const p = Float64Array.from({ length: n }, () => 1e-6 * (1 + 0.01 * g.next()));
    for (const shape of ['lorentzian', 'gaussian', 'voigt'] as const) {
      expect(() => fitRfLine({ frequencyHz: f, powerMw: p }, shape)).toThrow(/did not converge|no line standing out/);
    }
  });

  it('a flat spectrum', () => {
    const f = Float64Array.from({ length: 20 }, (_, i) => i);
    expect(() => fitRfLine({ frequencyHz: f, powerMw: new Float64Array(20).fill(1) }, 'gaussian')).toThrow(/flat/);
  });

  it('too few points in the band', () => {
    const s = makeSpectrum(problems[0], 1);
    expect(() => fitRfLine(s, 'lorentzian', { bandHz: [80e6, 80.01e6] })).toThrow(/at least 8 points/);
  });

  it('an unknown shape, a bad band, a bad start', () => {
    const s = makeSpectrum(problems[0], 1);
    expect(() => fitRfLine(s, 'sinc' as never)).toThrow(AnalysisInputError);
    expect(() => fitRfLine(s, 'lorentzian', { bandHz: [2, 1] })).toThrow(/bandHz/);
    expect(() => fitRfLine(s, 'lorentzian', { initial: { fwhmHz: -1 } })).toThrow(/initial.fwhmHz/);
  });
});

describe('fitRfLine(…, "voigt") on a pure line of one shape (a Voigt with one part 0 is that pure shape)', () => {
  const n = 801;
  const f = Float64Array.from({ length: n }, (_, i) => 80e6 - 1e6 + (2e6 * i) / (n - 1));
  const line = (shape: (x: number, w: number) => number) => Float64Array.from(f, (x) => 1e-6 + 1e-3 * shape(x - 80e6, 1.5e5));

  it('a Lorentzian of FWHM 150 kHz is reported as f_L = 150 kHz, f_G = 0, with a warning', () => {
    const fit = fitRfLine({ frequencyHz: f, powerMw: line(lorentzianShape) }, 'voigt');
    expect(rel(fit.fwhmHz, 1.5e5)).toBeLessThan(1e-6);
    expect(rel(fit.lorentzianFwhmHz as number, 1.5e5)).toBeLessThan(1e-6);
    expect(fit.gaussianFwhmHz).toBe(0);
    expect(fit.warnings.join(' ')).toMatch(/Gaussian part went to 0/);
  });

  it('a Gaussian of FWHM 150 kHz is reported as f_G = 150 kHz, f_L = 0, with a warning', () => {
    const fit = fitRfLine({ frequencyHz: f, powerMw: line(gaussianShape) }, 'voigt');
    expect(rel(fit.fwhmHz, 1.5e5)).toBeLessThan(1e-6);
    expect(rel(fit.gaussianFwhmHz as number, 1.5e5)).toBeLessThan(1e-6);
    expect(fit.lorentzianFwhmHz).toBe(0);
    expect(fit.warnings.join(' ')).toMatch(/Lorentzian part went to 0/);
  });
});
