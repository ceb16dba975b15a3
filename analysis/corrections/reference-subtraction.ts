/**
 * Heterodyne against a reference laser of known noise: the test laser's frequency noise is the beat's
 * minus the reference's, bin by bin; bins where the difference is not positive are flagged.
 *
 * Usage:
 *   import { subtractReference } from '../analysis/corrections/reference-subtraction';
 *   const r = subtractReference(beatSpectrum, { spectrum: referenceSpectrum });
 *   subtractReference(beatSpectrum, { linewidthHz: 1e3 });   // white level Δν_ref/π
 *   subtractReference(beatSpectrum, { identical: true });     // two identical lasers: half the beat
 *   r.spectrum (the kept bins, for the linewidth figures); r.frequencyNoiseHz2PerHz and r.status on the beat's grid
 *
 * Physics (Phaseloom METHODS 4.1): the beat phase is φ_test − φ_ref; for uncorrelated lasers
 * S_ν,beat = S_ν,test + S_ν,ref, so S_ν,test = S_ν,beat − S_ν,ref. A reference known by its Lorentzian
 * linewidth contributes the white level Δν_ref/π (Δν = π·S_ν,white). Two identical lasers: each has half
 * the beat's S_ν.
 * Reference spectrum: read on the beat's grid by power-law interpolation between its points
 * (analysis/linewidth/spectrum-grid.ts); beat bins outside the reference's grid are flagged, not extrapolated.
 * Status per bin: 0 kept, 1 difference ≤ 0 (the reference is not quieter there, or estimation scatter),
 * 2 outside the reference grid. Kept bins form `spectrum`; flagged bins are 0 in frequencyNoiseHz2PerHz.
 * A warning when the reference exceeds half the beat in more than 10 % of the bins (the difference is then
 * dominated by the scatter of the two estimates: each Welch bin scatters by 1/√K_eff, METHODS 1.3).
 * Units: Hz²/Hz in and out. Worked check: beat 1.5e4, reference linewidth π·5e3 Hz → test 1e4 Hz²/Hz
 * (METHODS 4.1: h₀ = 1e4 and 5e3 beat to FWHM π·1.5e4).
 */

import { AnalysisInputError } from '../errors';
import { checkSpectrum, psdAt } from '../linewidth/spectrum-grid';
import type { Spectrum } from '../types';

export type ReferenceLaser = { spectrum: Spectrum } | { linewidthHz: number } | { identical: true };

export const BIN_KEPT = 0;
export const BIN_NOT_POSITIVE = 1;
export const BIN_OUTSIDE_REFERENCE = 2;

export interface ReferenceCorrection {
  /** the kept bins of S_ν,test (all > 0), Hz²/Hz */
  spectrum: Spectrum;
  /** S_ν,test on the beat's grid (0 where flagged) */
  frequencyHz: Float64Array;
  frequencyNoiseHz2PerHz: Float64Array;
  /** per bin: 0 kept, 1 difference ≤ 0, 2 outside the reference grid */
  status: Uint8Array;
  notPositiveCount: number;
  outsideReferenceCount: number;
  method: 'spectrum' | 'white-level' | 'identical-halves';
  warnings: string[];
}

export function subtractReference(beat: Spectrum, reference: ReferenceLaser): ReferenceCorrection {
  checkSpectrum(beat, 'subtractReference (beat)');
  if (!reference || typeof reference !== 'object') throw new AnalysisInputError('the reference must be { spectrum }, { linewidthHz } or { identical: true }');
  const f = beat.frequencyHz;
  const b = beat.psd;
  const n = f.length;
  const out = new Float64Array(n);
  const status = new Uint8Array(n);
  let method: ReferenceCorrection['method'];
  const warnings: string[] = [];
  let comparable = 0;

  if ('identical' in reference) {
    if (reference.identical !== true) throw new AnalysisInputError('identical must be true');
    method = 'identical-halves';
    for (let i = 0; i < n; i++) out[i] = b[i] / 2; // each of two identical lasers: half the beat
  } else if ('linewidthHz' in reference) {
    const lw = reference.linewidthHz;
    if (!(typeof lw === 'number' && Number.isFinite(lw) && lw >= 0)) {
      throw new AnalysisInputError(`the reference linewidth must be a finite number of Hz >= 0, got ${String(lw)}`, 'reference.linewidthHz');
    }
    method = 'white-level';
    const level = lw / Math.PI; // S_ν,ref = Δν_ref/π
    for (let i = 0; i < n; i++) {
      out[i] = b[i] - level;
      if (level > 0.5 * b[i]) comparable++;
    }
  } else if ('spectrum' in reference) {
    const ref = reference.spectrum;
    checkSpectrum(ref, 'subtractReference (reference)');
    method = 'spectrum';
    const rf = ref.frequencyHz;
    const lo = rf[0];
    const hi = rf[rf.length - 1];
    for (let i = 0; i < n; i++) {
      if (f[i] < lo || f[i] > hi) {
        status[i] = BIN_OUTSIDE_REFERENCE;
        continue;
      }
      const r = psdAt(rf, ref.psd, f[i]);
      out[i] = b[i] - r; // S_ν,test = S_ν,beat − S_ν,ref
      if (r > 0.5 * b[i]) comparable++;
    }
  } else {
    throw new AnalysisInputError('the reference must be { spectrum }, { linewidthHz } or { identical: true }');
  }

  let notPositive = 0;
  let outside = 0;
  let kept = 0;
  for (let i = 0; i < n; i++) {
    if (status[i] === BIN_OUTSIDE_REFERENCE) {
      outside++;
      out[i] = 0;
    } else if (!(out[i] > 0)) {
      status[i] = BIN_NOT_POSITIVE;
      notPositive++;
      out[i] = 0;
    } else kept++;
  }
  const keptF = new Float64Array(kept);
  const keptS = new Float64Array(kept);
  for (let i = 0, j = 0; i < n; i++) {
    if (status[i] === BIN_KEPT) {
      keptF[j] = f[i];
      keptS[j++] = out[i];
    }
  }
  if (notPositive > 0) warnings.push(`${notPositive} bin(s) went to or below zero after subtracting the reference: they are flagged and left out`);
  if (outside > 0) warnings.push(`${outside} bin(s) lie outside the reference spectrum's band: they are flagged and left out`);
  if (comparable > 0.1 * n) {
    warnings.push(`the reference is more than half the beat in ${comparable} of ${n} bins: there the difference is dominated by the scatter of the two estimates`);
  }
  return {
    spectrum: { frequencyHz: keptF, psd: keptS },
    frequencyHz: f,
    frequencyNoiseHz2PerHz: out,
    status,
    notPositiveCount: notPositive,
    outsideReferenceCount: outside,
    method,
    warnings,
  };
}
