/** POST /api/invitations/preview {token} → the bench, address and role (404 unknown, 410 used or expired). */
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreviewResponse } from '../../../../server/contracts/invitations';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { invitationKeys } from './keys';

export function previewInvitation(token: string, signal?: AbortSignal): Promise<InvitationPreviewResponse> {
  return api.post<InvitationPreviewResponse>(apiPaths.invitations.preview(), { token }, { signal });
}

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) => previewInvitation(token, signal),
    retry: false,
  });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
