/**
 * GET /api/analyses/:id, as the upload form polls it: the first analysis of a new capture, fetched
 * every 750 ms while it is queued or running, to show its stage and percentage beside the upload.
 * (The spectra feature reads the same resource for its page under its own key; features do not
 * share query code.)
 */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Analysis } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { captureKeys } from './keys';

export function getUploadAnalysis(analysisId: string, signal?: AbortSignal): Promise<Analysis> {
  return api.get<Analysis>(apiPaths.analyses.detail(analysisId), { signal });
}

export const uploadAnalysisQueryOptions = (analysisId: string) =>
  queryOptions({
    queryKey: captureKeys.uploadAnalysis(analysisId),
    queryFn: ({ signal }) => getUploadAnalysis(analysisId, signal),
    staleTime: 0,
    refetchInterval: (query) => {
      if (query.state.status === 'error') return false;
      const status = query.state.data?.status;
      return status === undefined || status === 'queued' || status === 'running' ? 750 : false;
    },
  });

export function useUploadAnalysis(analysisId: string | null) {
  return useQuery({ ...uploadAnalysisQueryOptions(analysisId ?? ''), enabled: analysisId !== null });
}
