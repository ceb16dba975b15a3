/** GET /api/benches/:benchId/share-links → the bench's links with their state, never tokens (owner, analyst). */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ShareLinkListResponse } from '../../../../server/contracts/share-links';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { shareLinkKeys } from './keys';

export function getShareLinks(benchId: string, signal?: AbortSignal): Promise<ShareLinkListResponse> {
  return api.get<ShareLinkListResponse>(apiPaths.benches.shareLinks(benchId), { signal });
}

export const shareLinksQueryOptions = (benchId: string) =>
  queryOptions({ queryKey: shareLinkKeys.list(benchId), queryFn: ({ signal }) => getShareLinks(benchId, signal) });

export function useShareLinks(benchId: string, enabled = true) {
  return useQuery({ ...shareLinksQueryOptions(benchId), enabled });
}
