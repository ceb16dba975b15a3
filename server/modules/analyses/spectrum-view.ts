/**
 * GET /spectrum: the stored S_ν series (the engine's stitched spectrum) in one of four views, log-binned to at most N points, with the
 * engine's own helpers — geometric bins holding the mean of the linear S_ν (analysis/spectrum/
 * log-binning.ts), then the view of the binned spectrum (analysis/spectrum/views.ts):
 * S_φ = S_ν/f², L(f) = 10·log10(S_φ/2) dBc/Hz (IEEE Std 1139-2008), √S_ν.
 */
import { logBinSpectrum } from '../../../analysis/spectrum/log-binning';
import { spectrumView, type SpectrumViewName } from '../../../analysis/spectrum/views';
import { SPECTRUM_UNITS, type SpectrumResponse, type SpectrumView } from '../../contracts/analyses';
import type { Series } from '../../jobs/series-file';

const ENGINE_VIEW: Record<SpectrumView, SpectrumViewName> = {
  frequency: 'frequency-noise',
  phase: 'phase-noise',
  dbc: 'ssb-phase-noise',
  asd: 'frequency-noise-asd',
};

/**
 * Values travel with 7 significant digits (relative rounding ≤ 5·10⁻⁷): ample for a plot and for
 * reading a band mean off it, and a third of the bytes of full doubles. The full-precision series is
 * GET series.csv. dB of a zero S_ν is −Infinity: JSON has no such number, so it travels as null.
 */
const SIGNIFICANT_DIGITS = 7;
const forDisplay = (v: number): number => (Number.isFinite(v) ? Number(v.toPrecision(SIGNIFICANT_DIGITS)) : (null as unknown as number));

export function spectrumResponse(series: Series, view: SpectrumView, points: number): SpectrumResponse {
  // log bins from the lowest to the highest frequency: ⌊ppd·decades⌋ + 1 bins, so ask for one fewer
  // than N to return at most N points.
  const binned =
    series.frequencyHz.length <= points
      ? positiveFrequencies(series)
      : logBinSpectrum({ frequencyHz: series.frequencyHz, psd: series.psd }, { points: Math.max(1, points - 1) });
  const v = spectrumView({ frequencyHz: binned.frequencyHz, psd: binned.psd }, ENGINE_VIEW[view]);
  const values = Array.from(v.values, forDisplay);
  const frequencyHz = Array.from(v.frequencyHz, forDisplay);
  return { view, unit: SPECTRUM_UNITS[view], frequencyHz, values, points: frequencyHz.length };
}

/** The series without f ≤ 0 (a log axis has no place for DC), as log binning leaves it too. */
function positiveFrequencies(series: Series): Series {
  const keep: number[] = [];
  for (let i = 0; i < series.frequencyHz.length; i++) if (series.frequencyHz[i] > 0) keep.push(i);
  return {
    frequencyHz: Float64Array.from(keep, (i) => series.frequencyHz[i]),
    psd: Float64Array.from(keep, (i) => series.psd[i]),
  };
}
