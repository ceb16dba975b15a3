/** DELETE /api/corrections/:id → 204 (owner, analyst). */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { correctionKeys } from './keys';

export function deleteCorrection(id: string): Promise<void> {
  return api.delete(apiPaths.corrections.detail(id));
}

export function useDeleteCorrection(analysisId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteCorrection(id),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: correctionKeys.list(analysisId) }),
  });
}
