/**
 * GET /api/analyses/:id/spectrum?view=&points= → the log-binned display series of a finished analysis.
 * The page asks for the S_ν view and draws the other views from it (S_φ = S_ν/f², L(f) = 10·log10(S_φ/2),
 * √S_ν — the server's formulas), so switching views, moving the band and drawing the β-line all work
 * on one series without a round trip.
 */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { SpectrumResponse, SpectrumView } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { spectraKeys } from './keys';

/**
 * points asked for the plot: the API's default, about 90 per decade — as fine as the eye resolves at
 * 1024–1600 px, and each log bin still averages several Welch bins at high frequencies
 */
export const DISPLAY_POINTS = 400;

export function getSpectrum(analysisId: string, view: SpectrumView, points: number, signal?: AbortSignal): Promise<SpectrumResponse> {
  return api.get<SpectrumResponse>(apiPaths.analyses.spectrum(analysisId, { view, points }), { signal });
}

export const spectrumQueryOptions = (analysisId: string, view: SpectrumView = 'frequency', points = DISPLAY_POINTS) =>
  queryOptions({
    queryKey: spectraKeys.series(analysisId, view, points),
    queryFn: ({ signal }) => getSpectrum(analysisId, view, points, signal),
    staleTime: Infinity,
  });

export function useSpectrum(analysisId: string, view: SpectrumView = 'frequency', points = DISPLAY_POINTS) {
  return useSuspenseQuery(spectrumQueryOptions(analysisId, view, points)).data;
}
