/** GET /api/analyses/:id/allan → the overlapping Allan deviation (computed on the first request, then kept). */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AllanResponse } from '../../../../server/contracts/stability';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { stabilityKeys } from './keys';

export function getAllan(analysisId: string, signal?: AbortSignal): Promise<AllanResponse> {
  return api.get<AllanResponse>(apiPaths.analyses.allan(analysisId), { signal });
}

export const allanQueryOptions = (analysisId: string) =>
  queryOptions({
    queryKey: stabilityKeys.allan(analysisId),
    queryFn: ({ signal }) => getAllan(analysisId, signal),
    staleTime: Infinity,
    retry: false,
  });

/** Not suspending: the first computation reads the capture again and may take a moment. */
export function useAllan(analysisId: string, enabled: boolean) {
  return useQuery({ ...allanQueryOptions(analysisId), enabled });
}
