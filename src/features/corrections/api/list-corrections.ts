/** GET /api/analyses/:id/corrections → the analysis's corrections, newest first. */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CorrectionListResponse } from '../../../../server/contracts/corrections';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { correctionKeys } from './keys';

export function listCorrections(analysisId: string, signal?: AbortSignal): Promise<CorrectionListResponse> {
  return api.get<CorrectionListResponse>(apiPaths.analyses.corrections(analysisId), { signal });
}

export const correctionsQueryOptions = (analysisId: string) =>
  queryOptions({ queryKey: correctionKeys.list(analysisId), queryFn: ({ signal }) => listCorrections(analysisId, signal) });

export function useCorrections(analysisId: string, enabled: boolean) {
  return useQuery({ ...correctionsQueryOptions(analysisId), enabled });
}
