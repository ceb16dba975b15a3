/** GET /api/captures/:id → the capture (how it was taken) and its analyses. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { CaptureDetailResponse } from '../../../../server/contracts/captures';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { captureKeys } from './keys';

export function getCapture(captureId: string, signal?: AbortSignal): Promise<CaptureDetailResponse> {
  return api.get<CaptureDetailResponse>(apiPaths.captures.detail(captureId), { signal });
}

export const captureQueryOptions = (captureId: string) =>
  queryOptions({
    queryKey: captureKeys.detail(captureId),
    queryFn: ({ signal }) => getCapture(captureId, signal),
  });

export function useCapture(captureId: string) {
  return useSuspenseQuery(captureQueryOptions(captureId)).data;
}
