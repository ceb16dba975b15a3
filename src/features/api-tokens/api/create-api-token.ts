/** POST /api/me/tokens → 201 the token and its secret (in this reply only). */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateApiTokenRequest, CreatedApiTokenResponse } from '../../../../server/contracts/api-tokens';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { apiTokenKeys } from './keys';

export function createApiToken(body: CreateApiTokenRequest): Promise<CreatedApiTokenResponse> {
  return api.post<CreatedApiTokenResponse>(apiPaths.apiTokens.list(), body);
}

export function useCreateApiToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createApiToken,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: apiTokenKeys.all }),
  });
}
