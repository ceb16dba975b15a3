/** PATCH /api/benches/:benchId (owner) → the bench with its new name or description. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchResponse, UpdateBenchRequest } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { benchKeys } from './keys';

export function updateBench(benchId: string, body: UpdateBenchRequest): Promise<BenchResponse> {
  return api.patch<BenchResponse>(apiPaths.benches.detail(benchId), body);
}

export function useUpdateBench(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateBenchRequest) => updateBench(benchId, body),
    onSuccess: (data) => {
      queryClient.setQueryData(benchKeys.detail(benchId), data);
      return queryClient.invalidateQueries({ queryKey: benchKeys.all });
    },
  });
}
