/** GET /api/shared/:token (no sign-in) → the shared spectrum or overlay; 404 unknown, 410 revoked or expired. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { SharedResponse } from '../../../../server/contracts/share-links';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { shareLinkKeys } from './keys';

export function getShared(token: string, signal?: AbortSignal): Promise<SharedResponse> {
  return api.get<SharedResponse>(apiPaths.shared(token), { signal });
}

export const sharedQueryOptions = (token: string) =>
  queryOptions({ queryKey: shareLinkKeys.shared(token), queryFn: ({ signal }) => getShared(token, signal), retry: false, staleTime: 60_000 });

export function useShared(token: string) {
  return useSuspenseQuery(sharedQueryOptions(token)).data;
}
