/** PATCH /api/overlays/:id { name?, analysisIds? } (owner, analyst) → the overlay. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OverlayResponse, UpdateOverlayRequest } from '../../../../server/contracts/overlays';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { overlayKeys } from './keys';

export function updateOverlay(overlayId: string, body: UpdateOverlayRequest): Promise<OverlayResponse> {
  return api.patch<OverlayResponse>(apiPaths.overlays.detail(overlayId), body);
}

export function useUpdateOverlay(benchId: string, overlayId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateOverlayRequest) => updateOverlay(overlayId, body),
    onSuccess: (reply) => {
      queryClient.setQueryData(overlayKeys.detail(overlayId), reply);
      void queryClient.invalidateQueries({ queryKey: overlayKeys.list(benchId) });
    },
  });
}
