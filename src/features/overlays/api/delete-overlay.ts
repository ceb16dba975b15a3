/** DELETE /api/overlays/:id (owner, analyst) → 204. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { overlayKeys } from './keys';

export function deleteOverlay(overlayId: string): Promise<void> {
  return api.delete(apiPaths.overlays.detail(overlayId));
}

export function useDeleteOverlay(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (overlayId: string) => deleteOverlay(overlayId),
    onSuccess: (_v, overlayId) => {
      queryClient.removeQueries({ queryKey: overlayKeys.detail(overlayId) });
      void queryClient.invalidateQueries({ queryKey: overlayKeys.list(benchId) });
    },
  });
}
