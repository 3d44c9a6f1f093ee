import { kitchenSchema, type KitchenView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { queryKeys } from './query-keys';

/** The kitchen: name, address, declaring regime, household measures and allergen handling. */
export async function getKitchen({ signal }: { signal?: AbortSignal } = {}): Promise<KitchenView> {
  return kitchenSchema.parse(await apiClient.get<unknown>('/kitchen', { signal }));
}

export function getKitchenQueryOptions() {
  return queryOptions({
    queryKey: queryKeys.kitchen(),
    queryFn: ({ signal }) => getKitchen({ signal }),
    staleTime: 10 * 60_000,
  });
}

export function useKitchen() {
  return useQuery(getKitchenQueryOptions());
}
