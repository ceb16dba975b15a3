/** POST /api/benches/:benchId/lasers (owner, analyst) → 201 the laser, with λ and ν both filled in. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateLaserRequest, LaserResponse } from '../../../../server/contracts/lasers';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { laserKeys } from './keys';

export function createLaser(benchId: string, body: CreateLaserRequest): Promise<LaserResponse> {
  return api.post<LaserResponse>(apiPaths.benches.lasers(benchId), body);
}

export function useCreateLaser(benchId: string, { onChanged }: { onChanged?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateLaserRequest) => createLaser(benchId, body),
    onSuccess: () => {
      onChanged?.();
      // not awaited: the form resets at once and stays ready for the next entry while the list refreshes
      void queryClient.invalidateQueries({ queryKey: laserKeys.list(benchId) });
    },
  });
}
