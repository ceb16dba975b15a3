/** GET /api/benches/:benchId/rf-spectra → the bench's RF beat spectra (summaries, newest first). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { RfSpectrumListResponse } from '../../../../server/contracts/rf-spectra';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { rfSpectrumKeys } from './keys';

export function listRfSpectra(benchId: string, signal?: AbortSignal): Promise<RfSpectrumListResponse> {
  return api.get<RfSpectrumListResponse>(apiPaths.benches.rfSpectra(benchId), { signal });
}

export const rfSpectraQueryOptions = (benchId: string) =>
  queryOptions({
    queryKey: rfSpectrumKeys.list(benchId),
    queryFn: ({ signal }) => listRfSpectra(benchId, signal),
  });

export function useRfSpectra(benchId: string) {
  return useSuspenseQuery(rfSpectraQueryOptions(benchId)).data.rfSpectra;
}
