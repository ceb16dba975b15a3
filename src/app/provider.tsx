/**
 * The app's providers: one QueryClient and the router built on it. A 401 from any request means
 * the session ended: the cache forgets the person and the router goes to sign-in, keeping the
 * address the person was on.
 */
import { QueryClientProvider } from '@tanstack/react-query';
import { useState } from 'react';
import { RouterProvider } from 'react-router/dom';
import { paths } from '../config/paths';
import { authKeys } from '../features/auth/api/keys';
import { createQueryClient } from '../lib/query-client';
import { createAppRouter, type AppRouter } from './router';

function createApp() {
  let router: AppRouter | null = null;
  const queryClient = createQueryClient({
    onUnauthorized: () => {
      const where = window.location.pathname + window.location.search;
      if (where.startsWith(paths.auth.signIn.path) || where.startsWith(paths.auth.signUp.path)) return;
      queryClient.setQueryData(authKeys.me(), null);
      void router?.navigate(paths.auth.signIn.getHref(where), { replace: true });
    },
  });
  router = createAppRouter(queryClient);
  return { queryClient, router };
}

export function AppProvider() {
  const [{ queryClient, router }] = useState(createApp);
  return (
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  );
}
