import { kitchenSchema, type KitchenView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { useWorkingKitchen } from '@/lib/signed-in-user';
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

/**
 * The name of the kitchen the app answers for: the signed-in person's chosen kitchen, or the
 * kitchen's own settings on an installation whose kitchens are not set up yet.
 */
export function useKitchenName(): string | undefined {
  const working = useWorkingKitchen();
  const kitchen = useKitchen();
  return working?.name ?? kitchen.data?.name;
}
