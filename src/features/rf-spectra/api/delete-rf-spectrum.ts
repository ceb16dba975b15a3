/** DELETE /api/rf-spectra/:id → 204 (an owner, or the analyst who uploaded it). */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { rfSpectrumKeys } from './keys';

export function deleteRfSpectrum(id: string): Promise<void> {
  return api.delete(apiPaths.rfSpectra.detail(id));
}

export function useDeleteRfSpectrum(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => deleteRfSpectrum(id),
    onSuccess: (_void, id) => {
      queryClient.removeQueries({ queryKey: rfSpectrumKeys.detail(id) });
      return queryClient.invalidateQueries({ queryKey: rfSpectrumKeys.list(benchId) });
    },
  });
}
