/** GET /api/version → { name, version } of the running product, printed in every report's provenance. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { VersionResponse } from '../../../../server/contracts/reports';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { reportKeys } from './keys';

export function getVersion(signal?: AbortSignal): Promise<VersionResponse> {
  return api.get<VersionResponse>(apiPaths.version(), { signal });
}

export const versionQueryOptions = () =>
  queryOptions({
    queryKey: reportKeys.version(),
    queryFn: ({ signal }) => getVersion(signal),
    staleTime: Infinity,
  });

export function useVersion() {
  return useSuspenseQuery(versionQueryOptions()).data;
}
