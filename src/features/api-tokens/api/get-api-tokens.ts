/** GET /api/me/tokens → my personal API tokens (names, prefixes, dates; never the secrets). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { ApiTokenListResponse } from '../../../../server/contracts/api-tokens';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { apiTokenKeys } from './keys';

export function getApiTokens(signal?: AbortSignal): Promise<ApiTokenListResponse> {
  return api.get<ApiTokenListResponse>(apiPaths.apiTokens.list(), { signal });
}

export const apiTokensQueryOptions = () =>
  queryOptions({
    queryKey: apiTokenKeys.list(),
    queryFn: ({ signal }) => getApiTokens(signal),
  });

export function useApiTokens() {
  return useSuspenseQuery(apiTokensQueryOptions()).data.tokens;
}
