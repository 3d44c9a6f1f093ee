import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { isApiError } from './api-client';

/** Client errors (4xx) are answers, not glitches: retrying them only delays the message. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/**
 * A 401 or 403 from any request may mean the person's access changed since the page loaded (a
 * manager changed their role or deactivated them, which ends their sessions): who is signed in
 * is read again at once, so the menu follows the new role, or sign-in opens, at that request
 * rather than after a reload.
 */
function readAccessAgain(client: () => QueryClient, error: unknown, key?: readonly unknown[]) {
  if (!isApiError(error) || (error.status !== 401 && error.status !== 403)) return;
  if (key && key[0] === queryKeys.me()[0]) return;
  void client().invalidateQueries({ queryKey: queryKeys.me() });
}

export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => readAccessAgain(() => client, error, query.queryKey) }),
    mutationCache: new MutationCache({ onError: (error) => readAccessAgain(() => client, error) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: shouldRetry,
        refetchOnWindowFocus: false,
      },
      mutations: {
        retry: false,
      },
    },
  });
  return client;
}
