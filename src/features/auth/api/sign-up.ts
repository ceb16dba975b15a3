/** POST /api/auth/sign-up → 201 the new person, signed in (session cookie set by the server). */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignUpRequest, UserResponse } from '../../../../server/contracts/auth';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export function signUp(body: SignUpRequest): Promise<UserResponse> {
  return api.post<UserResponse>(apiPaths.auth.signUp(), body);
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => {
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
