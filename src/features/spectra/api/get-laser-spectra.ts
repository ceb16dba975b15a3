/** GET /api/benches/:benchId/lasers/:laserId/spectra → the laser and its analysed captures over time (latest done analysis each). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { LaserSpectraResponse } from '../../../../server/contracts/analyses';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { spectraKeys } from './keys';

export function getLaserSpectra(benchId: string, laserId: string, signal?: AbortSignal): Promise<LaserSpectraResponse> {
  return api.get<LaserSpectraResponse>(apiPaths.benches.laserSpectra(benchId, laserId), { signal });
}

export const laserSpectraQueryOptions = (benchId: string, laserId: string) =>
  queryOptions({
    queryKey: spectraKeys.laser(benchId, laserId),
    queryFn: ({ signal }) => getLaserSpectra(benchId, laserId, signal),
  });

export function useLaserSpectra(benchId: string, laserId: string) {
  return useSuspenseQuery(laserSpectraQueryOptions(benchId, laserId)).data;
}
