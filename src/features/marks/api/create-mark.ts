/** POST /api/captures/:captureId/marks (owner, analyst) → 201 { mark }. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateMarkRequest, MarkResponse } from '../../../../server/contracts/marks';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { marksKeys } from './keys';

export function createMark(captureId: string, body: CreateMarkRequest): Promise<MarkResponse> {
  return api.post<MarkResponse>(apiPaths.captures.marks(captureId), body);
}

export function useCreateMark(captureId: string, { onCreated }: { onCreated?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateMarkRequest) => createMark(captureId, body),
    onSuccess: () => {
      onCreated?.();
      return queryClient.invalidateQueries({ queryKey: marksKeys.marks(captureId) });
    },
  });
}
