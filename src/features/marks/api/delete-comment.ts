/** DELETE /api/comments/:id (its author, or an owner) → 204. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function deleteComment(commentId: string): Promise<void> {
  return api.delete(apiPaths.comments.detail(commentId));
}

export function useDeleteComment(captureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (commentId: string) => deleteComment(commentId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: marksKeys.comments(captureId) }),
  });
}
