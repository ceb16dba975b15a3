/** Query keys of the captures feature, general → specific. */
import type { CaptureKind } from '../../../../server/contracts/captures';

export interface CaptureFilters {
  laserId?: string;
  kind?: CaptureKind;
  tag?: string;
  page: number;
  pageSize: number;
}

export const captureKeys = {
  all: ['captures'] as const,
  lists: () => [...captureKeys.all, 'list'] as const,
  benchLists: (benchId: string) => [...captureKeys.lists(), benchId] as const,
  list: (benchId: string, filters: CaptureFilters) => [...captureKeys.benchLists(benchId), filters] as const,
  details: () => [...captureKeys.all, 'detail'] as const,
  detail: (captureId: string) => [...captureKeys.details(), captureId] as const,
  /** the analysis an upload started, polled while it runs */
  uploadAnalysis: (analysisId: string) => [...captureKeys.all, 'upload-analysis', analysisId] as const,
};
