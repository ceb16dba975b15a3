/**
 * Views of a frequency-noise PSD: S_φ, L(f), √S_ν.
 *
 * Usage:
 *   import { spectrumView } from '../analysis/spectrum/views';
 *   spectrumView(s, 'ssb-phase-noise');    // { frequencyHz, values (dBc/Hz), unit: 'dBc/Hz' } (f = 0 dropped)
 *
 *   'frequency-noise'      S_ν           Hz²/Hz   (as given)
 *   'phase-noise'          S_φ = S_ν/f²  rad²/Hz  (ν = (1/2π)·dφ/dt ⇒ S_ν = f²·S_φ)
 *   'ssb-phase-noise'      L(f) = 10·log10(S_φ/2) dBc/Hz (IEEE Std 1139-2008 definition L = S_φ/2;
 *                          the SSB noise-to-carrier ratio only where ∫_f^∞ S_φ df' ≪ 1 rad²)
 *   'frequency-noise-asd'  √S_ν          Hz/√Hz
 * Views that divide by f drop the f = 0 point. A zero S_ν gives −Infinity dBc/Hz (kept, as the
 * plain value). Reference: IEEE Std 1139-2008, "IEEE Standard Definitions of Physical Quantities for
 * Fundamental Frequency and Time Metrology — Random Instabilities" (2009).
 * Worked check: S_ν = 1e4 Hz²/Hz at f = 1 MHz → S_φ = 1e-8 rad²/Hz, L = −83.01 dBc/Hz.
 */

import { AnalysisInputError } from '../errors';
import type { Spectrum } from '../types';

export type SpectrumViewName = 'frequency-noise' | 'phase-noise' | 'ssb-phase-noise' | 'frequency-noise-asd';
export type SpectrumViewUnit = 'Hz²/Hz' | 'rad²/Hz' | 'dBc/Hz' | 'Hz/√Hz';

export const SPECTRUM_VIEWS: Record<SpectrumViewName, SpectrumViewUnit> = {
  'frequency-noise': 'Hz²/Hz',
  'phase-noise': 'rad²/Hz',
  'ssb-phase-noise': 'dBc/Hz',
  'frequency-noise-asd': 'Hz/√Hz',
};

export interface SpectrumView {
  name: SpectrumViewName;
  unit: SpectrumViewUnit;
  frequencyHz: Float64Array;
  values: Float64Array;
}

/** S_φ(f) = S_ν(f)/f² [rad²/Hz]. */
export function phaseNoiseFromFrequencyNoise(sNu: number, frequencyHz: number): number {
  return sNu / (frequencyHz * frequencyHz);
}

/** L(f) = 10·log10(S_φ/2) [dBc/Hz] from S_ν (IEEE Std 1139). */
export function ssbPhaseNoiseDbcFromFrequencyNoise(sNu: number, frequencyHz: number): number {
  return 10 * Math.log10(phaseNoiseFromFrequencyNoise(sNu, frequencyHz) / 2);
}

export function spectrumView(spectrum: Spectrum, name: SpectrumViewName): SpectrumView {
  if (!(name in SPECTRUM_VIEWS)) {
    throw new AnalysisInputError(`view must be one of ${Object.keys(SPECTRUM_VIEWS).join(', ')}, got ${String(name)}`);
  }
  const { frequencyHz: f, psd } = spectrum;
  if (f.length !== psd.length) {
    throw new AnalysisInputError(`frequency and PSD lengths differ (${f.length} vs ${psd.length})`);
  }
  const dropZero = name === 'phase-noise' || name === 'ssb-phase-noise';
  let count = 0;
  for (let i = 0; i < f.length; i++) if (!dropZero || f[i] > 0) count++;
  const fo = new Float64Array(count);
  const v = new Float64Array(count);
  let j = 0;
  for (let i = 0; i < f.length; i++) {
    if (dropZero && !(f[i] > 0)) continue;
    fo[j] = f[i];
    switch (name) {
      case 'frequency-noise':
        v[j] = psd[i];
        break;
      case 'phase-noise':
        v[j] = phaseNoiseFromFrequencyNoise(psd[i], f[i]); // S_φ = S_ν/f²
        break;
      case 'ssb-phase-noise':
        v[j] = ssbPhaseNoiseDbcFromFrequencyNoise(psd[i], f[i]); // L = 10·log10(S_φ/2)
        break;
      case 'frequency-noise-asd':
        v[j] = Math.sqrt(psd[i]); // √S_ν
        break;
    }
    j++;
  }
  return { name, unit: SPECTRUM_VIEWS[name], frequencyHz: fo, values: v };
}
