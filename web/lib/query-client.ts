import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

const SESSION_QUERY_KEY = ['auth', 'me'] as const;
const MAX_RETRIES_AFTER_SERVER_ERROR = 2;

function isSessionLost(error: unknown): boolean {
  return isApiError(error) && error.status === 401 && error.code === 'not_signed_in';
}

/**
 * The app's QueryClient. Client errors (4xx) are never retried; a lost session seen by any query
 * or mutation re-checks `GET /api/auth/me`, whose failure sends the shell back to sign-in.
 */
export function createQueryClient(): QueryClient {
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isSessionLost(error) && query.queryKey[0] !== SESSION_QUERY_KEY[0]) {
          void queryClient.invalidateQueries({ queryKey: SESSION_QUERY_KEY });
        }
      },
    }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isSessionLost(error)) void queryClient.invalidateQueries({ queryKey: SESSION_QUERY_KEY });
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (failureCount, error) =>
          !(isApiError(error) && error.status >= 400 && error.status < 500) && failureCount < MAX_RETRIES_AFTER_SERVER_ERROR,
      },
      mutations: { retry: false },
    },
  });
  return queryClient;
}
