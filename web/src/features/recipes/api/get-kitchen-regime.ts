import { kitchenSchema, REGIMES, type Regime } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';

/**
 * The kitchen, read under the same key and with the same shared schema as the header's query,
 * so the two share one cached answer. Recipes only need the regime the kitchen declares under.
 */

export async function getKitchen({ signal }: { signal?: AbortSignal } = {}) {
  return kitchenSchema.parse(await apiClient.get<unknown>('/kitchen', { signal }));
}

export function getKitchenQueryOptions() {
  return queryOptions({ queryKey: ['kitchen'], queryFn: ({ signal }) => getKitchen({ signal }), staleTime: 10 * 60_000 });
}

export function isRegime(value: string | null | undefined): value is Regime {
  return typeof value === 'string' && (REGIMES as readonly string[]).includes(value);
}

/**
 * The kitchen's regime (undefined if it cannot be read: the API then uses the kitchen's own),
 * and whether it is still loading, so a page can wait rather than ask twice.
 */
export function useKitchenRegime(): { regime: Regime | undefined; isPending: boolean } {
  const kitchen = useQuery(getKitchenQueryOptions());
  const regime = kitchen.data?.regime;
  return { regime: isRegime(regime) ? regime : undefined, isPending: kitchen.isPending };
}
