/** GET /api/outbox → e-mail caught by the local mail catcher, newest first (404 in production). */
import { useQuery } from '@tanstack/react-query';
import type { OutboxListResponse } from '../../../../server/contracts/outbox';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export const outboxKeys = { all: ['outbox'] as const };

export function getOutbox(signal?: AbortSignal): Promise<OutboxListResponse> {
  return api.get<OutboxListResponse>(apiPaths.outbox(), { signal });
}

export function useOutbox() {
  return useQuery({ queryKey: outboxKeys.all, queryFn: ({ signal }) => getOutbox(signal), refetchInterval: 3000, retry: false });
}
