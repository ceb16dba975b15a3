/** POST /api/captures/:id/analyses { settings } (owner, analyst) → 201 { analysis }: a new analysis kept beside the earlier ones. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AnalysisResponse, AnalysisSettings, CreateAnalysisRequest } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { spectraKeys } from './keys';

export function createAnalysis(captureId: string, settings: AnalysisSettings): Promise<AnalysisResponse> {
  const body: CreateAnalysisRequest = { settings };
  return api.post<AnalysisResponse>(apiPaths.captures.analyses(captureId), body);
}

export function useCreateAnalysis(captureId: string, { onCreated }: { onCreated?: (analysisId: string) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (settings: AnalysisSettings) => createAnalysis(captureId, settings),
    onSuccess: (data) => {
      queryClient.setQueryData(spectraKeys.analysis(data.analysis.id), data.analysis);
      onCreated?.(data.analysis.id);
      // laser trends and capture lists elsewhere pick up the new figures when they come
      return queryClient.invalidateQueries({ queryKey: spectraKeys.lasers() });
    },
  });
}
