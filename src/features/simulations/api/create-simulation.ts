/** POST /api/benches/:benchId/simulations (owner, analyst) → 202 the queued run. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateSimulationRequest, SimulationResponse } from '../../../../server/contracts/simulations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { simulationKeys } from './keys';

export function createSimulation(benchId: string, body: CreateSimulationRequest): Promise<SimulationResponse> {
  return api.post<SimulationResponse>(apiPaths.benches.simulations(benchId), body);
}

export function useCreateSimulation(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateSimulationRequest) => createSimulation(benchId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: simulationKeys.list(benchId) }),
  });
}
