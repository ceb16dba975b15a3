/** GET /api/benches/:benchId/lasers → the lasers on a bench. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { LaserListResponse } from '../../../../server/contracts/lasers';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { laserKeys } from './keys';

export function getLasers(benchId: string, signal?: AbortSignal): Promise<LaserListResponse> {
  return api.get<LaserListResponse>(apiPaths.benches.lasers(benchId), { signal });
}

export const lasersQueryOptions = (benchId: string) =>
  queryOptions({
    queryKey: laserKeys.list(benchId),
    queryFn: ({ signal }) => getLasers(benchId, signal),
  });

export function useLasers(benchId: string) {
  return useSuspenseQuery(lasersQueryOptions(benchId)).data.lasers;
}
