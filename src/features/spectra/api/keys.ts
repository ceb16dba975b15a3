/** Query keys of the spectra feature, general → specific. */
import type { SpectrumView } from '../../../../server/contracts/analyses';

export const spectraKeys = {
  all: ['spectra'] as const,
  analyses: () => [...spectraKeys.all, 'analysis'] as const,
  analysis: (analysisId: string) => [...spectraKeys.analyses(), analysisId] as const,
  series: (analysisId: string, view: SpectrumView, points: number) => [...spectraKeys.analysis(analysisId), 'series', view, points] as const,
  lasers: () => [...spectraKeys.all, 'laser'] as const,
  laser: (benchId: string, laserId: string) => [...spectraKeys.lasers(), benchId, laserId] as const,
};
