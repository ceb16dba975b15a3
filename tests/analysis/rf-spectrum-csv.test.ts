import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import { parseRfSpectrumCsv } from '../../analysis/rf/spectrum-csv';

describe('parseRfSpectrumCsv(text) reads frequency and power columns', () => {
  it('"f (MHz),P (dBm)" → Hz and linear mW: 1 MHz, −30 dBm → 1e6 Hz, 1e-3 mW (P = 10^(dBm/10))', () => {
    const s = parseRfSpectrumCsv('f (MHz),P (dBm)\n1,-30\n2,-20\n3,-30\n');
    expect(Array.from(s.frequencyHz)).toEqual([1e6, 2e6, 3e6]);
    expect(s.powerMw[0]).toBeCloseTo(1e-3, 15);
    expect(s.powerMw[1]).toBeCloseTo(1e-2, 15);
    expect(s.powerUnit).toBe('dBm');
    expect(s.powerUnitFrom).toBe('header');
    expect(s.frequencyUnit).toBe('MHz');
    expect(s.frequencyUnitFrom).toBe('header');
    expect(s.columns).toEqual(['f (MHz)', 'P (dBm)']);
    expect(s.rows).toBe(3);
  });

  it('a preamble of key,value lines is metadata; an RBW line gives resolutionBandwidthHz', () => {
    const text = '# exported trace\nInstrument,bench analyser\nRBW,1 kHz\nCenter frequency,80000000\nfrequency_hz;power_mw\n1;0.5\n2;1\n3;0.5\n';
    const s = parseRfSpectrumCsv(text);
    expect(s.metadata['Instrument']).toBe('bench analyser');
    expect(s.metadata['Center frequency']).toBe('80000000');
    expect(s.resolutionBandwidthHz).toBe(1000);
    expect(s.powerUnit).toBe('mW');
    expect(Array.from(s.powerMw)).toEqual([0.5, 1, 0.5]);
    expect(Array.from(s.frequencyHz)).toEqual([1, 2, 3]);
  });

  it('white-space columns, W → mW, and options override the header', () => {
    const s = parseRfSpectrumCsv('10 0.001\n20 0.002\n30 0.001', { powerUnit: 'W', frequencyUnit: 'kHz' });
    expect(Array.from(s.frequencyHz)).toEqual([1e4, 2e4, 3e4]);
    expect(Array.from(s.powerMw)).toEqual([1, 2, 1]);
    expect(s.powerUnitFrom).toBe('option');
  });

  it('without a stated unit, negative values are read as dBm with a warning', () => {
    const s = parseRfSpectrumCsv('1,-50\n2,-40\n3,-50');
    expect(s.powerUnitFrom).toBe('negative-values');
    expect(s.warnings.join(' ')).toMatch(/read as dBm/);
  });

  it('bytes with a BOM and a decimal comma (semicolon delimiter)', () => {
    const bytes = new TextEncoder().encode('\ufefffreq_GHz;level_dBm\n1,5;-10,5\n1,6;-3\n1,7;-10,5\n');
    const s = parseRfSpectrumCsv(bytes, { decimalComma: true });
    expect(s.frequencyHz[0]).toBeCloseTo(1.5e9, 3);
    expect(s.powerMw[1]).toBeCloseTo(10 ** -0.3, 12);
  });

  it('extra columns are ignored with a warning', () => {
    const s = parseRfSpectrumCsv('f_hz,p_dbm,trace2\n1,-3,-4\n2,-2,-4\n3,-3,-4');
    expect(s.warnings.join(' ')).toMatch(/first two columns/);
  });
});

describe('parseRfSpectrumCsv rejects bad input, naming the rule', () => {
  it('an empty file', () => expect(() => parseRfSpectrumCsv('')).toThrow(/holds no data rows/));
  it('a header only', () => expect(() => parseRfSpectrumCsv('f_hz,p_dbm\n')).toThrow(AnalysisInputError));
  it('fewer than 3 rows', () => expect(() => parseRfSpectrumCsv('f_hz,p_dbm\n1,-3\n2,-4')).toThrow(/at least 3/));
  it('frequencies not increasing, naming the line', () =>
    expect(() => parseRfSpectrumCsv('f_hz,p_dbm\n1,-3\n3,-4\n2,-5')).toThrow(/increase strictly.*line 4/));
  it('a non-numeric data row', () => expect(() => parseRfSpectrumCsv('f_hz,p_dbm\n1,-3\n2,abc\n3,-5')).toThrow(/expected two numbers.*line 3/));
  it('non-finite values', () => expect(() => parseRfSpectrumCsv('f_hz,p_dbm\n1,-3\n2,inf\n3,-5')).toThrow(/finite/));
  it('all-positive values with no unit stated', () => expect(() => parseRfSpectrumCsv('1,3\n2,4\n3,5')).toThrow(/power unit is not stated/));
  it('a negative linear power', () => expect(() => parseRfSpectrumCsv('f_hz,p_mw\n1,3\n2,-4\n3,5')).toThrow(/linear power must be >= 0/));
  it('an unknown power unit option', () => expect(() => parseRfSpectrumCsv('1,3\n2,4\n3,5', { powerUnit: 'dBW' as never })).toThrow(/powerUnit/));
  it('too many rows', () => expect(() => parseRfSpectrumCsv('1,-3\n2,-4\n3,-5\n4,-6', { maxRows: 3 })).toThrow(/more than 3 rows/));
});
