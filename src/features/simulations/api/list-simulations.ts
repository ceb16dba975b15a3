/** GET /api/benches/:benchId/simulations → the bench's runs, newest first; fetched again every second while a run or its analysis goes on. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { SimulationListResponse } from '../../../../server/contracts/simulations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { simulationKeys } from './keys';

export function listSimulations(benchId: string, signal?: AbortSignal): Promise<SimulationListResponse> {
  return api.get<SimulationListResponse>(apiPaths.benches.simulations(benchId), { signal });
}

const busy = (status: string | undefined) => status === 'queued' || status === 'running';
/** a run still integrating, or its capture still being analysed */
const running = (data: SimulationListResponse | undefined) => Boolean(data?.simulations.some((s) => busy(s.status) || busy(s.analysis?.status)));

export const simulationsQueryOptions = (benchId: string) =>
  queryOptions({
    queryKey: simulationKeys.list(benchId),
    queryFn: ({ signal }) => listSimulations(benchId, signal),
    refetchInterval: (query) => (running(query.state.data) ? 1000 : false),
  });

export function useSimulations(benchId: string) {
  return useSuspenseQuery(simulationsQueryOptions(benchId)).data.simulations;
}
