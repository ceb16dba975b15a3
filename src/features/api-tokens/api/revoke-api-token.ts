/** DELETE /api/me/tokens/:tokenId → 204; the token stops working at once. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { apiTokenKeys } from './keys';

export function revokeApiToken(tokenId: string): Promise<void> {
  return api.delete(apiPaths.apiTokens.detail(tokenId));
}

export function useRevokeApiToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeApiToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: apiTokenKeys.all }),
  });
}
