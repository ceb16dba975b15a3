/** PATCH /api/benches/:benchId/members/:userId (owner) → the member with the new role. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MemberResponse, UpdateMemberRequest } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export function updateMemberRole(benchId: string, userId: string, body: UpdateMemberRequest): Promise<MemberResponse> {
  return api.patch<MemberResponse>(apiPaths.benches.member(benchId, userId), body);
}

export function useUpdateMemberRole(benchId: string, { onChanged }: { onChanged?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: string } & UpdateMemberRequest) => updateMemberRole(benchId, userId, { role }),
    onSuccess: () => {
      onChanged?.();
      return queryClient.invalidateQueries({ queryKey: memberKeys.list(benchId) });
    },
  });
}
