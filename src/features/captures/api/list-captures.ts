/** GET /api/benches/:benchId/captures?laserId=&kind=&tag=&page=&pageSize= → a page of captures with their latest analysis. */
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { CaptureListResponse } from '../../../../server/contracts/captures';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { captureKeys, type CaptureFilters } from './keys';

export function listCaptures(benchId: string, filters: CaptureFilters, signal?: AbortSignal): Promise<CaptureListResponse> {
  return api.get<CaptureListResponse>(apiPaths.benches.captures(benchId, filters), { signal });
}

/** Any capture still queued or running? Then the list is fetched again every 2 s. */
export function hasWorkInProgress(data: CaptureListResponse | undefined): boolean {
  return Boolean(data?.captures.some((c) => c.latestAnalysis && (c.latestAnalysis.status === 'queued' || c.latestAnalysis.status === 'running')));
}

export const capturesQueryOptions = (benchId: string, filters: CaptureFilters) =>
  queryOptions({
    queryKey: captureKeys.list(benchId, filters),
    queryFn: ({ signal }) => listCaptures(benchId, filters, signal),
    placeholderData: keepPreviousData,
    refetchInterval: (query) => (hasWorkInProgress(query.state.data) ? 2000 : false),
  });

export function useCaptures(benchId: string, filters: CaptureFilters) {
  return useQuery(capturesQueryOptions(benchId, filters));
}
