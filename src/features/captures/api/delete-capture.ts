/** DELETE /api/captures/:id (the analyst who uploaded it, or an owner) → 204; file and rows go together. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { captureKeys } from './keys';

export function deleteCapture(captureId: string): Promise<void> {
  return api.delete(apiPaths.captures.detail(captureId));
}

export function useDeleteCapture({ onDeleted }: { onDeleted?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (captureId: string) => deleteCapture(captureId),
    onSuccess: (_data, captureId) => {
      queryClient.removeQueries({ queryKey: captureKeys.detail(captureId) });
      onDeleted?.();
      return queryClient.invalidateQueries({ queryKey: captureKeys.lists() });
    },
  });
}
