/** POST /api/auth/sign-out → 204; the session ends and every cached answer is dropped. */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '../../../config/paths';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export function signOut(): Promise<void> {
  return api.post<void>(apiPaths.auth.signOut());
}

/** `onSignedOut` leaves the signed-in pages (it may return the navigation's promise). */
export function useSignOut({ onSignedOut }: { onSignedOut?: () => unknown } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      queryClient.setQueryData(authKeys.me(), null);
      await onSignedOut?.();
      // the pages that read them are gone now; drop everything that belonged to the session
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
    },
  });
}
