/** GET /api/captures/:captureId/marks → the capture's marks (lowest frequency first) and the band they may sit in. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { MarksResponse } from '../../../../server/contracts/marks';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function listMarks(captureId: string, signal?: AbortSignal): Promise<MarksResponse> {
  return api.get<MarksResponse>(apiPaths.captures.marks(captureId), { signal });
}

export const marksQueryOptions = (captureId: string) =>
  queryOptions({
    queryKey: marksKeys.marks(captureId),
    queryFn: ({ signal }) => listMarks(captureId, signal),
  });

export function useMarks(captureId: string) {
  return useSuspenseQuery(marksQueryOptions(captureId)).data;
}
