/** GET /api/benches → the benches the signed-in person belongs to, with counts. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { BenchListResponse } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { benchKeys } from './keys';

export function getBenches(signal?: AbortSignal): Promise<BenchListResponse> {
  return api.get<BenchListResponse>(apiPaths.benches.list(), { signal });
}

export const benchesQueryOptions = () =>
  queryOptions({
    queryKey: benchKeys.lists(),
    queryFn: ({ signal }) => getBenches(signal),
  });

export function useBenches() {
  return useSuspenseQuery(benchesQueryOptions()).data.benches;
}
