/** GET /api/me → the signed-in person, or null when there is no session (401). */
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { useRef } from 'react';
import type { User, UserResponse } from '../../../../server/contracts/auth';
import { apiPaths } from '../../../config/paths';
import { api, isApiError } from '../../../lib/api-client';
import { authKeys } from './keys';

export async function getMe(signal?: AbortSignal): Promise<User | null> {
  try {
    const { user } = await api.get<UserResponse>(apiPaths.me(), { signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 5 * 60_000,
  });

/** The signed-in person or null. */
export function useMe() {
  return useSuspenseQuery(meQueryOptions()).data;
}

/**
 * The signed-in person, on pages behind the sign-in guard (the guard's loader made sure). While
 * the page is being left after a sign-out (the cache already says null), it keeps the last person
 * it knew, so the page does not break on its way out.
 */
export function useSignedInUser(): User {
  const user = useMe();
  const last = useRef<User | null>(user);
  if (user) last.current = user;
  if (!last.current) throw new Error('useSignedInUser() used on a page that is not behind the sign-in guard');
  return last.current;
}
