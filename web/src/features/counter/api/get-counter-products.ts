import type { CounterProductsView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Every product for sale with its served declaration, the regime's groups and today's display (GET /api/counter/products). */
export async function getCounterProducts({ signal }: { signal?: AbortSignal } = {}): Promise<CounterProductsView> {
  return apiClient.get<CounterProductsView>('/counter/products', { signal });
}

export function getCounterProductsQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.counter.products(),
    queryFn: ({ signal }) => getCounterProducts({ signal }),
    // The events stream says when it changes; nothing else makes it stale.
    staleTime: Infinity,
  });
}

/** The counter's one read: every lookup is worked out from it in the browser. */
export function useCounterProducts() {
  return useQuery(getCounterProductsQueryOptions());
}
