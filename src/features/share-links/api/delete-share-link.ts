/** DELETE /api/share-links/:id (owner, analyst) → 204; the link answers 410 from then on. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { shareLinkKeys } from './keys';

export function revokeShareLink(linkId: string): Promise<void> {
  return api.delete(apiPaths.shareLinks.detail(linkId));
}

export function useRevokeShareLink(benchId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (linkId: string) => revokeShareLink(linkId),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: shareLinkKeys.list(benchId) }),
  });
}
