/** POST /api/benches/:benchId/members (owner) → 201 the new member (an existing account). */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddMemberRequest, MemberResponse } from '../../../../server/contracts/benches';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { memberKeys } from './keys';

export function addMember(benchId: string, body: AddMemberRequest): Promise<MemberResponse> {
  return api.post<MemberResponse>(apiPaths.benches.members(benchId), body);
}

export function useAddMember(benchId: string, { onChanged }: { onChanged?: () => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AddMemberRequest) => addMember(benchId, body),
    onSuccess: () => {
      onChanged?.();
      // not awaited: the form resets at once and stays ready for the next entry while the list refreshes
      void queryClient.invalidateQueries({ queryKey: memberKeys.list(benchId) });
    },
  });
}
