/**
 * GET /api/analyses/:id → one analysis (the object itself, not wrapped): status, progress and stage while it runs; settings, the
 * engine's result (the CLI's JSON) and the headline figures once done. Fetched again every second
 * while queued or running.
 */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { Analysis, AnalysisStatus } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { spectraKeys } from './keys';

export function getAnalysis(analysisId: string, signal?: AbortSignal): Promise<Analysis> {
  return api.get<Analysis>(apiPaths.analyses.detail(analysisId), { signal });
}

export function isUnderway(status: AnalysisStatus | undefined): boolean {
  return status === 'queued' || status === 'running';
}

export const analysisQueryOptions = (analysisId: string) =>
  queryOptions({
    queryKey: spectraKeys.analysis(analysisId),
    queryFn: ({ signal }) => getAnalysis(analysisId, signal),
    refetchInterval: (query) => (query.state.status !== 'error' && isUnderway(query.state.data?.status) ? 1000 : false),
    // a finished analysis never changes; one still running is never fresh
    staleTime: (query) => (isUnderway(query.state.data?.status) ? 0 : Infinity),
  });

export function useAnalysis(analysisId: string) {
  return useSuspenseQuery(analysisQueryOptions(analysisId)).data;
}
