/** GET /api/benches/:benchId/members → everyone on the bench with their role. */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { MemberListResponse } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export function getMembers(benchId: string, signal?: AbortSignal): Promise<MemberListResponse> {
  return api.get<MemberListResponse>(apiPaths.benches.members(benchId), { signal });
}

export const membersQueryOptions = (benchId: string) =>
  queryOptions({
    queryKey: memberKeys.list(benchId),
    queryFn: ({ signal }) => getMembers(benchId, signal),
  });

export function useMembers(benchId: string) {
  return useSuspenseQuery(membersQueryOptions(benchId)).data.members;
}
