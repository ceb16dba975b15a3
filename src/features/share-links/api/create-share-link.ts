/** POST /api/analyses/:id/share-links or /api/overlays/:id/share-links { expiresAt? } (owner, analyst) → 201 { id, url }. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateShareLinkRequest, CreateShareLinkResponse, ShareTargetKind } from '../../../../server/contracts/share-links';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { shareLinkKeys } from './keys';

export interface ShareTarget {
  kind: ShareTargetKind;
  id: string;
}

export function createShareLink(target: ShareTarget, body: CreateShareLinkRequest): Promise<CreateShareLinkResponse> {
  const url = target.kind === 'analysis' ? apiPaths.analyses.shareLinks(target.id) : apiPaths.overlays.shareLinks(target.id);
  return api.post<CreateShareLinkResponse>(url, body);
}

export function useCreateShareLink(benchId: string, target: ShareTarget) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateShareLinkRequest) => createShareLink(target, body),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: shareLinkKeys.list(benchId) }),
  });
}
