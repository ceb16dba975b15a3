/** GET /api/rf-spectra/:id → one RF beat spectrum with its trace, fitted curves and figures. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { RfSpectrumResponse } from '../../../../server/contracts/rf-spectra';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { rfSpectrumKeys } from './keys';

export function getRfSpectrum(id: string, signal?: AbortSignal): Promise<RfSpectrumResponse> {
  return api.get<RfSpectrumResponse>(apiPaths.rfSpectra.detail(id), { signal });
}

export const rfSpectrumQueryOptions = (id: string) =>
  queryOptions({
    queryKey: rfSpectrumKeys.detail(id),
    queryFn: ({ signal }) => getRfSpectrum(id, signal),
    // a stored spectrum never changes
    staleTime: Infinity,
  });

export function useRfSpectrum(id: string) {
  return useSuspenseQuery(rfSpectrumQueryOptions(id)).data.rfSpectrum;
}
