/** GET /api/benches/:benchId/lasers/:laserId/sweep?parameter= → points and, for output power, the 1/P fits. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { SweepParameter, SweepResponse } from '../../../../server/contracts/sweeps';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { sweepKeys } from './keys';

export function getSweep(benchId: string, laserId: string, parameter: SweepParameter, signal?: AbortSignal): Promise<SweepResponse> {
  return api.get<SweepResponse>(apiPaths.benches.sweep(benchId, laserId, parameter), { signal });
}

export const sweepQueryOptions = (benchId: string, laserId: string, parameter: SweepParameter) =>
  queryOptions({ queryKey: sweepKeys.sweep(benchId, laserId, parameter), queryFn: ({ signal }) => getSweep(benchId, laserId, parameter, signal) });

export function useSweep(benchId: string, laserId: string, parameter: SweepParameter) {
  return useSuspenseQuery(sweepQueryOptions(benchId, laserId, parameter)).data;
}
