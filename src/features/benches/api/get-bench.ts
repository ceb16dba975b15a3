/** GET /api/benches/:benchId → one bench with the caller's role on it. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { BenchResponse } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { benchKeys } from './keys';

export function getBench(benchId: string, signal?: AbortSignal): Promise<BenchResponse> {
  return api.get<BenchResponse>(apiPaths.benches.detail(benchId), { signal });
}

export const benchQueryOptions = (benchId: string) =>
  queryOptions({
    queryKey: benchKeys.detail(benchId),
    queryFn: ({ signal }) => getBench(benchId, signal),
  });

export function useBench(benchId: string) {
  return useSuspenseQuery(benchQueryOptions(benchId)).data.bench;
}
