/** GET /api/captures/:captureId/comments → the capture's thread, oldest first. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { CommentsResponse } from '../../../../server/contracts/comments';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function listComments(captureId: string, signal?: AbortSignal): Promise<CommentsResponse> {
  return api.get<CommentsResponse>(apiPaths.captures.comments(captureId), { signal });
}

export const commentsQueryOptions = (captureId: string) =>
  queryOptions({
    queryKey: marksKeys.comments(captureId),
    queryFn: ({ signal }) => listComments(captureId, signal),
  });

export function useComments(captureId: string) {
  return useSuspenseQuery(commentsQueryOptions(captureId)).data.comments;
}
