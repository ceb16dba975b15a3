/** POST /api/laser-estimates → cold-cavity, Schawlow–Townes and α-enhanced (Henry) linewidths (nothing stored). */
import { useMutation } from '@tanstack/react-query';
import type { LaserEstimateRequest, LaserEstimateResponse } from '../../../../server/contracts/laser-estimates';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export function estimateLaser(body: LaserEstimateRequest): Promise<LaserEstimateResponse> {
  return api.post<LaserEstimateResponse>(apiPaths.laserEstimates(), body);
}

export function useEstimateLaser() {
  return useMutation({ mutationFn: estimateLaser });
}
