/**
 * The TanStack Query client. Queries are not retried on 4xx answers (they will not change by
 * asking again); network and 5xx failures are retried once. A hook for 401 lets the app send the
 * user back to sign-in when the session has ended.
 */
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

export interface QueryClientHooks {
  /** called when any query or mutation answers 401 */
  onUnauthorized?: () => void;
}

export function createQueryClient(hooks: QueryClientHooks = {}): QueryClient {
  const handle = (error: unknown) => {
    if (isApiError(error) && error.status === 401) hooks.onUnauthorized?.();
  };
  return new QueryClient({
    queryCache: new QueryCache({ onError: handle }),
    mutationCache: new MutationCache({ onError: handle }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) => {
          if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
          return failureCount < 1;
        },
      },
      mutations: { retry: false },
    },
  });
}
