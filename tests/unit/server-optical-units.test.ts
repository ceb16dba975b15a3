import { describe, expect, it } from 'vitest';
import {
  frequencyThzToWavelengthNm,
  nominalLine,
  SPEED_OF_LIGHT,
  wavelengthNmToFrequencyThz,
} from '../../server/modules/lasers/optical-units';

describe('optical units (c = 299 792 458 m/s exact, SI)', () => {
  it('SPEED_OF_LIGHT is the defined value 299 792 458 m/s', () => {
    expect(SPEED_OF_LIGHT).toBe(299_792_458);
  });

  // ITU-T G.694.1 anchors its DWDM grid at 193.1 THz; METHODS.md §8 gives λ = 1552.5244 nm there.
  it('frequencyThzToWavelengthNm(193.1) is 1552.5244 nm (ITU-T G.694.1 anchor, METHODS §8)', () => {
    expect(frequencyThzToWavelengthNm(193.1)).toBeCloseTo(1552.5244, 4);
  });

  it('wavelengthNmToFrequencyThz(1552.5244) is 193.1 THz to the 0.1 pm rounding of the wavelength', () => {
    expect(wavelengthNmToFrequencyThz(1552.5244)).toBeCloseTo(193.1, 5);
  });

  // METHODS §9 case 17: 0.1 GHz at 193.1 THz spans 0.80400 pm (dλ = λ² dν / c).
  it('0.1 GHz at 193.1 THz spans 0.80400 pm (METHODS §9 case 17)', () => {
    const spanPm = (frequencyThzToWavelengthNm(193.1 - 0.00005) - frequencyThzToWavelengthNm(193.1 + 0.00005)) * 1000;
    expect(spanPm).toBeCloseTo(0.804, 5);
  });

  it('one conversion undoes the other', () => {
    for (const nm of [632.8, 1064, 1310, 1550.12, 2000]) {
      expect(frequencyThzToWavelengthNm(wavelengthNmToFrequencyThz(nm))).toBeCloseTo(nm, 9);
    }
  });

  it('nominalLine keeps the given unit as it is and derives the other', () => {
    expect(nominalLine({ wavelengthNm: 1550.12 })).toEqual({ wavelengthNm: 1550.12, frequencyThz: SPEED_OF_LIGHT / 1550.12 / 1000 });
    expect(nominalLine({ frequencyThz: 193.1 })).toEqual({ wavelengthNm: SPEED_OF_LIGHT / 193.1 / 1000, frequencyThz: 193.1 });
    expect(nominalLine({})).toEqual({ wavelengthNm: null, frequencyThz: null });
    expect(nominalLine({ wavelengthNm: null, frequencyThz: null })).toEqual({ wavelengthNm: null, frequencyThz: null });
  });
});
