import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { analyseBeatSpectrum } from '../../analysis/rf/beat-spectrum-analysis';
import { lorentzianShape } from '../../analysis/rf/line-shapes';
import { parseRfSpectrumCsv } from '../../analysis/rf/spectrum-csv';

const rel = (a: number, b: number) => Math.abs(a / b - 1);

/** A CSV export of a Lorentzian beat (FWHM w around 80 MHz, −20 dBm peak) on a −80 dBm floor, 2001 points over ±1 MHz. */
function lorentzianCsv(w: number): string {
  const rows = ['frequency_MHz,power_dBm'];
  for (let i = 0; i < 2001; i++) {
    const f = 79 + (2 * i) / 2000;
    const mw = 1e-2 * lorentzianShape((f - 80) * 1e6, w) + 1e-8;
    rows.push(`${f.toFixed(6)},${(10 * Math.log10(mw)).toFixed(6)}`);
  }
  return rows.join('\n');
}

describe('analyseBeatSpectrum(spectrum, options): fits, −20 dB width and the self-heterodyne reading', () => {
  it('a Lorentzian DSH beat of 2π·1e4 Hz from a dBm CSV: Lorentzian fits best; laser = beat/2 = 31.42 kHz from the fit and from the −20 dB width', () => {
    const spectrum = parseRfSpectrumCsv(lorentzianCsv(2 * Math.PI * 1e4));
    const r = analyseBeatSpectrum(spectrum, { mode: 'self-heterodyne', fiberLengthM: 25e3 });
    expect(r.fits.map((o) => o.shape)).toEqual(['lorentzian', 'gaussian', 'voigt']);
    expect(r.bestShape).toBe('lorentzian');
    const lor = r.fits[0].fit!;
    expect(rel(lor.fwhmHz, 2 * Math.PI * 1e4)).toBeLessThan(1e-4); // the dBm text is rounded to 1e-6 dB
    expect(rel(r.selfHeterodyne!.fromFit.lorentzian!.laserLinewidthHz, Math.PI * 1e4)).toBeLessThan(1e-4);
    expect(rel(r.twentyDb!.lorentzianFwhmHz, 2 * Math.PI * 1e4)).toBeLessThan(2e-3);
    expect(rel(r.selfHeterodyne!.fromTwentyDb!.laserLinewidthHz, Math.PI * 1e4)).toBeLessThan(2e-3);
    expect(r.selfHeterodyne!.fromFit.lorentzian!.assumption).toMatch(/half the beat width/);
  });

  it("mode 'beat' gives no self-heterodyne reading; a subset of shapes is honoured", () => {
    const spectrum = parseRfSpectrumCsv(lorentzianCsv(5e4));
    const r = analyseBeatSpectrum(spectrum, { shapes: ['gaussian'] });
    expect(r.selfHeterodyne).toBeNull();
    expect(r.fits).toHaveLength(1);
    expect(r.bestShape).toBe('gaussian');
  });

  it('a spectrum no shape can fit is an AnalysisInputError listing each failure', () => {
    const f = Float64Array.from({ length: 50 }, (_, i) => i);
    expect(() => analyseBeatSpectrum({ frequencyHz: f, powerMw: new Float64Array(50).fill(1) })).toThrow(/no line shape could be fitted: lorentzian: .*flat/);
  });

  it('rejects bad options', () => {
    const spectrum = parseRfSpectrumCsv(lorentzianCsv(5e4));
    expect(() => analyseBeatSpectrum(spectrum, { mode: 'dsh' as never })).toThrow(/mode must be/);
    expect(() => analyseBeatSpectrum(spectrum, { shapes: [] })).toThrow(/shapes must list/);
    expect(() => analyseBeatSpectrum(spectrum, { delayS: 1e-4 })).toThrow(AnalysisInputError);
  });
});
