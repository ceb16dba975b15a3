/** DELETE /api/benches/:benchId/lasers/:laserId (owner, analyst) → 204. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { laserKeys } from './keys';

export function deleteLaser(benchId: string, laserId: string): Promise<void> {
  return api.delete(apiPaths.benches.laser(benchId, laserId));
}

export function useDeleteLaser(benchId: string, { onChanged }: { onChanged?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (laserId: string) => deleteLaser(benchId, laserId),
    onSuccess: () => {
      onChanged?.();
      return queryClient.invalidateQueries({ queryKey: laserKeys.list(benchId) });
    },
  });
}
