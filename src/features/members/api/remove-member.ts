/**
 * DELETE /api/benches/:benchId/members/:userId → 204. The owner removes someone; anyone may remove
 * themselves (leave the bench).
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export function removeMember(benchId: string, userId: string): Promise<void> {
  return api.delete(apiPaths.benches.member(benchId, userId));
}

export function useRemoveMember(benchId: string, { onChanged }: { onChanged?: (userId: string) => unknown } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => removeMember(benchId, userId),
    onSuccess: async (_data, userId) => {
      await onChanged?.(userId);
      return queryClient.invalidateQueries({ queryKey: memberKeys.list(benchId) });
    },
  });
}
