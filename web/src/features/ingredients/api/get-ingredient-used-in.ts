import type { UsedIn } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/** Every recipe and product using the ingredient at any depth. */
export async function getIngredientUsedIn(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<UsedIn[]> {
  return apiClient.get<UsedIn[]>(`/ingredients/${encodeURIComponent(code)}/used-in`, { signal });
}

export function getIngredientUsedInQueryOptions(code: string) {
  return queryOptions({
    queryKey: queryKeys.ingredients.usedIn(code),
    queryFn: ({ signal }) => getIngredientUsedIn(code, { signal }),
  });
}

export function useIngredientUsedIn(code: string) {
  return useQuery(getIngredientUsedInQueryOptions(code));
}
