/** POST /api/analyses/:id/corrections → 201 { correction } (owner, analyst); 400 with the reason otherwise. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CorrectionResponse, CreateCorrectionRequest } from '../../../../server/contracts/corrections';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { correctionKeys } from './keys';

export function createCorrection(analysisId: string, body: CreateCorrectionRequest): Promise<CorrectionResponse> {
  return api.post<CorrectionResponse>(apiPaths.analyses.corrections(analysisId), body);
}

export function useCreateCorrection(analysisId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCorrectionRequest) => createCorrection(analysisId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: correctionKeys.list(analysisId) }),
  });
}
