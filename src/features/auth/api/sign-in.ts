/** POST /api/auth/sign-in → the person, with the session cookie set by the server. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInRequest, UserResponse } from '../../../../server/contracts/auth';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export function signIn(body: SignInRequest): Promise<UserResponse> {
  return api.post<UserResponse>(apiPaths.auth.signIn(), body);
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // nothing cached for someone else survives a sign-in
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
