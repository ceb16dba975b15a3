/** POST /api/benches → 201 the new bench; the creator is its owner. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchResponse, CreateBenchRequest } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { benchKeys } from './keys';

export function createBench(body: CreateBenchRequest): Promise<BenchResponse> {
  return api.post<BenchResponse>(apiPaths.benches.list(), body);
}

export function useCreateBench() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBench,
    onSuccess: ({ bench }) => {
      queryClient.setQueryData(benchKeys.detail(bench.id), { bench });
      return queryClient.invalidateQueries({ queryKey: benchKeys.lists() });
    },
  });
}
