/** PATCH /api/marks/:id (its author, or an owner) → { mark }. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkResponse, UpdateMarkRequest } from '../../../../server/contracts/marks';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function updateMark(markId: string, body: UpdateMarkRequest): Promise<MarkResponse> {
  return api.patch<MarkResponse>(apiPaths.marks.detail(markId), body);
}

export function useUpdateMark(captureId: string, { onUpdated }: { onUpdated?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ markId, body }: { markId: string; body: UpdateMarkRequest }) => updateMark(markId, body),
    onSuccess: () => {
      onUpdated?.();
      return queryClient.invalidateQueries({ queryKey: marksKeys.marks(captureId) });
    },
  });
}
