/**
 * POST /api/invitations/accept → the bench joined. Signed in as the invited address: adds the
 * membership; signed out without an account: `name` + `password` create it and sign in.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationRequest, AcceptInvitationResponse } from '../../../../server/contracts/invitations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';

export function acceptInvitation(body: AcceptInvitationRequest): Promise<AcceptInvitationResponse> {
  return api.post<AcceptInvitationResponse>(apiPaths.invitations.accept(), body);
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    // a new session (or a new bench for this one): start from a clean cache; the next page reads /api/me again
    onSuccess: () => queryClient.removeQueries(),
  });
}
