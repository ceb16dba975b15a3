/**
 * Loader guards. Pages behind sign-in send a signed-out visitor to /sign-in?redirectTo=<where
 * they were going>; the sign-in pages send a signed-in visitor on to their benches.
 */
import type { QueryClient } from '@tanstack/react-query';
import { redirect } from 'react-router';
import type { User } from '../../../server/contracts/auth';
import { paths, safeRedirectTarget } from '../../config/paths';
import { meQueryOptions } from '../../features/auth/api/get-me';

export async function requireUser(queryClient: QueryClient, request: Request): Promise<User> {
  const user = await queryClient.ensureQueryData(meQueryOptions());
  if (!user) {
    const url = new URL(request.url);
    throw redirect(paths.auth.signIn.getHref(url.pathname + url.search));
  }
  return user;
}

export async function requireGuest(queryClient: QueryClient, request: Request): Promise<null> {
  const user = await queryClient.ensureQueryData(meQueryOptions());
  if (user) {
    const url = new URL(request.url);
    throw redirect(safeRedirectTarget(url.searchParams.get('redirectTo')));
  }
  return null;
}
