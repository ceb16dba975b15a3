/** GET /api/overlays/:id → one overlay with its traces, figures and display series (any member). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { OverlayResponse } from '../../../../server/contracts/overlays';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { overlayKeys } from './keys';

export function getOverlay(overlayId: string, signal?: AbortSignal): Promise<OverlayResponse> {
  return api.get<OverlayResponse>(apiPaths.overlays.detail(overlayId), { signal });
}

export const overlayQueryOptions = (overlayId: string) =>
  queryOptions({ queryKey: overlayKeys.detail(overlayId), queryFn: ({ signal }) => getOverlay(overlayId, signal) });

export function useOverlay(overlayId: string) {
  return useSuspenseQuery(overlayQueryOptions(overlayId)).data.overlay;
}
