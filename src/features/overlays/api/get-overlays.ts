/** GET /api/benches/:benchId/overlays → the bench's saved overlays (any member). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { OverlayListResponse } from '../../../../server/contracts/overlays';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { overlayKeys } from './keys';

export function getOverlays(benchId: string, signal?: AbortSignal): Promise<OverlayListResponse> {
  return api.get<OverlayListResponse>(apiPaths.benches.overlays(benchId), { signal });
}

export const overlaysQueryOptions = (benchId: string) =>
  queryOptions({ queryKey: overlayKeys.list(benchId), queryFn: ({ signal }) => getOverlays(benchId, signal) });

export function useOverlays(benchId: string) {
  return useSuspenseQuery(overlaysQueryOptions(benchId)).data.overlays;
}
