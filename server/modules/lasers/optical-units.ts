/**
 * Vacuum wavelength ↔ optical frequency of a laser's nominal line.
 *   ν = c / λ  with c = 299 792 458 m/s exactly (SI definition of the metre, 1983/2019).
 *   In the units stored: ν[THz] = c / (λ[nm]·1e-9) / 1e12 = c / λ[nm] / 1000, and λ[nm] = c / ν[THz] / 1000.
 * Worked check: 193.1 THz (the ITU-T G.694.1 DWDM grid anchor) ↔ 1552.5244 nm.
 */

/** Speed of light in vacuum, m/s (exact). */
export const SPEED_OF_LIGHT = 299_792_458;

export function wavelengthNmToFrequencyThz(wavelengthNm: number): number {
  return SPEED_OF_LIGHT / wavelengthNm / 1000;
}

export function frequencyThzToWavelengthNm(frequencyThz: number): number {
  return SPEED_OF_LIGHT / frequencyThz / 1000;
}

/**
 * Both units from whichever one was given: `{ wavelengthNm }`, `{ frequencyThz }` or neither
 * (both null). The given value is kept as it is; the other is derived.
 */
export function nominalLine(given: { wavelengthNm?: number | null; frequencyThz?: number | null }): {
  wavelengthNm: number | null;
  frequencyThz: number | null;
} {
  if (given.wavelengthNm != null) {
    return { wavelengthNm: given.wavelengthNm, frequencyThz: wavelengthNmToFrequencyThz(given.wavelengthNm) };
  }
  if (given.frequencyThz != null) {
    return { wavelengthNm: frequencyThzToWavelengthNm(given.frequencyThz), frequencyThz: given.frequencyThz };
  }
  return { wavelengthNm: null, frequencyThz: null };
}
