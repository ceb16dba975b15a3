/** GET /api/benches/:benchId/invitations (owner) → the bench's invitations with their status. */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationListResponse } from '../../../../server/contracts/invitations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './keys';

export function getInvitations(benchId: string, signal?: AbortSignal): Promise<InvitationListResponse> {
  return api.get<InvitationListResponse>(apiPaths.invitations.ofBench(benchId), { signal });
}

export const invitationsQueryOptions = (benchId: string) =>
  queryOptions({ queryKey: invitationKeys.ofBench(benchId), queryFn: ({ signal }) => getInvitations(benchId, signal) });

export function useInvitations(benchId: string) {
  return useQuery(invitationsQueryOptions(benchId));
}
