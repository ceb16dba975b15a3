/** POST /api/benches/:benchId/overlays (owner, analyst) → 201 the overlay. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateOverlayRequest, OverlayResponse } from '../../../../server/contracts/overlays';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { overlayKeys } from './keys';

export function createOverlay(benchId: string, body: CreateOverlayRequest): Promise<OverlayResponse> {
  return api.post<OverlayResponse>(apiPaths.benches.overlays(benchId), body);
}

export function useCreateOverlay(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateOverlayRequest) => createOverlay(benchId, body),
    onSuccess: ({ overlay }) => {
      queryClient.setQueryData(overlayKeys.detail(overlay.id), { overlay });
      void queryClient.invalidateQueries({ queryKey: overlayKeys.list(benchId) });
    },
  });
}
