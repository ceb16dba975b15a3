/** DELETE /api/benches/:benchId (owner) → 204; the bench and everything on it are gone. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { benchKeys } from './keys';

export function deleteBench(benchId: string): Promise<void> {
  return api.delete(apiPaths.benches.detail(benchId));
}

/**
 * `onDeleted` should leave the bench's pages (it may return the navigation's promise); the bench's
 * cached answers are dropped after that, so the page being left never refetches a deleted bench.
 */
export function useDeleteBench(benchId: string, { onDeleted }: { onDeleted?: () => unknown } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteBench(benchId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: benchKeys.lists() });
      await onDeleted?.();
      queryClient.removeQueries({ queryKey: benchKeys.detail(benchId) });
    },
  });
}
