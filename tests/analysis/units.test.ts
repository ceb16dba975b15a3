import { describe, expect, it } from 'vitest';

import { AnalysisInputError } from '../../analysis/errors';
import {
  PLANCK_CONSTANT_J_S,
  SPEED_OF_LIGHT_M_PER_S,
  frequencyThzToWavelengthNm,
  frequencyWidthHzToWavelengthWidthPm,
  photonEnergyJ,
  wavelengthNmToFrequencyThz,
  wavelengthWidthPmToFrequencyWidthHz,
} from '../../analysis/units';

describe('units: constants', () => {
  it('SPEED_OF_LIGHT_M_PER_S is 299 792 458 m/s exactly (BIPM, The SI, 9th ed. 2019)', () => {
    expect(SPEED_OF_LIGHT_M_PER_S).toBe(299_792_458);
  });

  it('PLANCK_CONSTANT_J_S is 6.626 070 15e-34 J s exactly (BIPM, The SI, 9th ed. 2019)', () => {
    expect(PLANCK_CONSTANT_J_S).toBe(6.62607015e-34);
  });
});

describe('units: wavelength and optical frequency', () => {
  it('frequencyThzToWavelengthNm(193.1) = 1552.5244 nm (METHODS 8, ITU-T G.694.1 grid anchor)', () => {
    expect(frequencyThzToWavelengthNm(193.1)).toBeCloseTo(1552.5244, 4);
  });

  it('wavelengthNmToFrequencyThz(1552.5244) = 193.1 THz (METHODS 8)', () => {
    expect(wavelengthNmToFrequencyThz(1552.5244)).toBeCloseTo(193.1, 5);
  });

  it('wavelength → frequency → wavelength is the identity (λ = c/ν both ways)', () => {
    for (const nm of [780.24, 1064, 1310, 1549.32, 1560.61]) {
      expect(frequencyThzToWavelengthNm(wavelengthNmToFrequencyThz(nm))).toBeCloseTo(nm, 10);
    }
  });

  it('photonEnergyJ(193.1) = 1.27949e-19 J (METHODS 8)', () => {
    expect(photonEnergyJ(193.1) / 1.27949e-19).toBeCloseTo(1, 5);
  });
});

describe('units: frequency width ↔ wavelength width, Δλ = λ²Δν/c', () => {
  it('frequencyWidthHzToWavelengthWidthPm(0.1 GHz, 193.1 THz) = 0.80400 pm (METHODS 8 and check 17)', () => {
    expect(frequencyWidthHzToWavelengthWidthPm(0.1e9, 193.1)).toBeCloseTo(0.804, 5);
    // "100 MHz is about 0.8 pm near 1550 nm" — common practice, no source
    expect(frequencyWidthHzToWavelengthWidthPm(100e6, 193.1)).toBeCloseTo(0.8, 1);
  });

  it('gives the METHODS 8 table: 1 MHz → 0.00804 pm, 12.5 GHz → 100.50 pm, 50 GHz → 402.00 pm, 100 GHz → 804.00 pm', () => {
    expect(frequencyWidthHzToWavelengthWidthPm(1e6, 193.1)).toBeCloseTo(0.00804, 5);
    expect(frequencyWidthHzToWavelengthWidthPm(12.5e9, 193.1)).toBeCloseTo(100.5, 2);
    expect(frequencyWidthHzToWavelengthWidthPm(50e9, 193.1)).toBeCloseTo(402.0, 2);
    expect(frequencyWidthHzToWavelengthWidthPm(100e9, 193.1)).toBeCloseTo(804.0, 2);
  });

  it('wavelengthWidthPmToFrequencyWidthHz inverts it', () => {
    expect(wavelengthWidthPmToFrequencyWidthHz(0.804, 193.1) / 0.1e9).toBeCloseTo(1, 4);
    expect(wavelengthWidthPmToFrequencyWidthHz(frequencyWidthHzToWavelengthWidthPm(31415.93, 193.1), 193.1)).toBeCloseTo(31415.93, 6);
  });
});

describe('units: rejected inputs', () => {
  it('wavelengthNmToFrequencyThz(0) throws AnalysisInputError', () => {
    expect(() => wavelengthNmToFrequencyThz(0)).toThrow(AnalysisInputError);
  });

  it('frequencyThzToWavelengthNm(NaN) throws AnalysisInputError', () => {
    expect(() => frequencyThzToWavelengthNm(Number.NaN)).toThrow(AnalysisInputError);
  });

  it('frequencyWidthHzToWavelengthWidthPm(-1, 193.1) throws AnalysisInputError', () => {
    expect(() => frequencyWidthHzToWavelengthWidthPm(-1, 193.1)).toThrow(/widthHz/);
  });

  it('wavelengthWidthPmToFrequencyWidthHz(1, -193.1) throws AnalysisInputError', () => {
    expect(() => wavelengthWidthPmToFrequencyWidthHz(1, -193.1)).toThrow(AnalysisInputError);
  });
});
