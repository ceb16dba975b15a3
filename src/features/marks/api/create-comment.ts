/** POST /api/captures/:captureId/comments (owner, analyst) → 201 { comment }. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CommentResponse, CreateCommentRequest } from '../../../../server/contracts/comments';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function createComment(captureId: string, body: CreateCommentRequest): Promise<CommentResponse> {
  return api.post<CommentResponse>(apiPaths.captures.comments(captureId), body);
}

export function useCreateComment(captureId: string, { onCreated }: { onCreated?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCommentRequest) => createComment(captureId, body),
    onSuccess: () => {
      onCreated?.();
      return queryClient.invalidateQueries({ queryKey: marksKeys.comments(captureId) });
    },
  });
}
