/** PATCH /api/benches/:benchId/lasers/:laserId (owner, analyst) → the laser as stored. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LaserResponse, UpdateLaserRequest } from '../../../../server/contracts/lasers';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { laserKeys } from './keys';

export function updateLaser(benchId: string, laserId: string, body: UpdateLaserRequest): Promise<LaserResponse> {
  return api.patch<LaserResponse>(apiPaths.benches.laser(benchId, laserId), body);
}

export function useUpdateLaser(benchId: string, { onChanged }: { onChanged?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ laserId, body }: { laserId: string; body: UpdateLaserRequest }) => updateLaser(benchId, laserId, body),
    onSuccess: () => {
      onChanged?.();
      return queryClient.invalidateQueries({ queryKey: laserKeys.list(benchId) });
    },
  });
}
