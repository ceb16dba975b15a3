/** POST /api/benches/:benchId/invitations (owner) → 201 the invitation; the e-mail carries the link. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateInvitationRequest, InvitationResponse } from '../../../../server/contracts/invitations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './keys';

export function createInvitation(benchId: string, body: CreateInvitationRequest): Promise<InvitationResponse> {
  return api.post<InvitationResponse>(apiPaths.invitations.ofBench(benchId), body);
}

export function useCreateInvitation(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationRequest) => createInvitation(benchId, body),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: invitationKeys.ofBench(benchId) }),
  });
}
