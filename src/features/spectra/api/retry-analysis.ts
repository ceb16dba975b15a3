/** POST /api/analyses/:id/retry (owner, analyst; failed analyses only) → { analysis } queued again. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AnalysisResponse } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { spectraKeys } from './keys';

export function retryAnalysis(analysisId: string): Promise<AnalysisResponse> {
  return api.post<AnalysisResponse>(apiPaths.analyses.retry(analysisId));
}

export function useRetryAnalysis(analysisId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => retryAnalysis(analysisId),
    onSuccess: (data) => {
      queryClient.setQueryData(spectraKeys.analysis(analysisId), data.analysis);
      return queryClient.invalidateQueries({ queryKey: spectraKeys.analysis(analysisId) });
    },
  });
}
