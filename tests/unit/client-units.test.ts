// Client number formatting (src/lib/units.ts). Checks are hand arithmetic on SI prefixes
// (BIPM, "The International System of Units (SI)", 9th ed., 2019: prefixes in steps of 10³) and one
// fact of the trade: the ITU-T G.694.1 DWDM grid lists 193.40 THz beside 1550.12 nm (from memory).
import { describe, expect, it } from 'vitest';
import { wavelengthNmToFrequencyThz } from '../../analysis/units';
import { formatFixed, formatFrequencyThz, formatScientific, formatSI, formatWavelengthNm } from '../../src/lib/units';

const NBSP = '\u00a0';

describe('formatSI', () => {
  it.each([
    [12_400, 'Hz', 3, `12.4${NBSP}kHz`],
    [1.5e-6, 's', 3, `1.50${NBSP}µs`],
    [193.4e12, 'Hz', 4, `193.4${NBSP}THz`],
    [0.25, 'rad', 2, `250${NBSP}mrad`],
    [1, 'Hz', 3, `1.00${NBSP}Hz`],
    [999.96, 'Hz', 4, `1.000${NBSP}kHz`], // rounding carries into the next prefix
    [-3_100, 'Hz', 2, `\u22123.1${NBSP}kHz`], // typographic minus
  ])('formatSI(%d, %s, { significant: %d }) gives %s', (value, unit, significant, expected) => {
    expect(formatSI(value, unit, { significant }).text).toBe(expected);
  });

  it('formatSI(0, "Hz") keeps the requested precision and no prefix', () => {
    expect(formatSI(0, 'Hz').text).toBe(`0.00${NBSP}Hz`);
  });

  it('formatSI(3000, "Hz", { trim: true }) drops trailing zeros', () => {
    expect(formatSI(3000, 'Hz', { trim: true }).text).toBe(`3${NBSP}kHz`);
  });

  it('formatSI splits number and prefixed unit for the mono renderer', () => {
    expect(formatSI(12_400, 'Hz')).toEqual({ number: '12.4', unit: 'kHz', text: `12.4${NBSP}kHz` });
  });

  it('formatSI(NaN) prints a dash, not "NaN"', () => {
    expect(formatSI(Number.NaN, 'Hz').number).toBe('—');
  });

  it('formatSI(x, u, { significant: 0 }) is refused with the rule in the message', () => {
    expect(() => formatSI(1, 'Hz', { significant: 0 })).toThrow(/significant must be an integer from 1 to 15/);
  });
});

describe('formatScientific', () => {
  it('formatScientific(31_000, "Hz²/Hz", 2) gives 3.1 × 10⁴ Hz²/Hz', () => {
    expect(formatScientific(31_000, 'Hz²/Hz', 2).text).toBe(`3.1 × 10⁴${NBSP}Hz²/Hz`);
  });
  it('formatScientific(2.5e-12, "rad²/Hz") writes a superscript minus', () => {
    expect(formatScientific(2.5e-12, 'rad²/Hz', 2).text).toBe(`2.5 × 10⁻¹²${NBSP}rad²/Hz`);
  });
  it('formatScientific(4.2, "Hz") leaves out × 10⁰', () => {
    expect(formatScientific(4.2, 'Hz', 2).text).toBe(`4.2${NBSP}Hz`);
  });
});

describe('formatFixed, formatWavelengthNm, formatFrequencyThz', () => {
  it('formatFixed(1550.12, "nm", 3, true) gives 1550.12 nm', () => {
    expect(formatFixed(1550.12, 'nm', 3, true).text).toBe(`1550.12${NBSP}nm`);
  });
  it('formatFixed(-0.0001, "nm", 2) does not print a negative zero', () => {
    expect(formatFixed(-0.0001, 'nm', 2).text).toBe(`0.00${NBSP}nm`);
  });
  it('formatWavelengthNm(null) and formatFrequencyThz(null) print a dash with the unit', () => {
    expect(formatWavelengthNm(null).text).toBe(`—${NBSP}nm`);
    expect(formatFrequencyThz(null).text).toBe(`—${NBSP}THz`);
  });
  it('1550.12 nm shows as 193.400 THz, as on the ITU-T G.694.1 grid (193.40 THz ↔ 1550.12 nm)', () => {
    expect(formatWavelengthNm(1550.12).text).toBe(`1550.12${NBSP}nm`);
    expect(formatFrequencyThz(wavelengthNmToFrequencyThz(1550.12)).text).toBe(`193.400${NBSP}THz`);
  });
});
