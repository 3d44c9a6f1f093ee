import type { KitchenMakes } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** What the kitchen makes differently from the shared book: its own ingredients standing in, and what it sells (manager, pastry chef). */
export async function getKitchenMakes({ signal }: { signal?: AbortSignal } = {}): Promise<KitchenMakes> {
  return apiClient.get<KitchenMakes>('/book/kitchen', { signal });
}

export function getKitchenMakesQueryOptions() {
  return queryOptions({ queryKey: queryKeys.kitchenMakes(), queryFn: ({ signal }) => getKitchenMakes({ signal }) });
}

export function useKitchenMakes() {
  return useQuery(getKitchenMakesQueryOptions());
}
