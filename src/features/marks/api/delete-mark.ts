/** DELETE /api/marks/:id (its author, or an owner) → 204. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function deleteMark(markId: string): Promise<void> {
  return api.delete(apiPaths.marks.detail(markId));
}

export function useDeleteMark(captureId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (markId: string) => deleteMark(markId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: marksKeys.marks(captureId) }),
  });
}
