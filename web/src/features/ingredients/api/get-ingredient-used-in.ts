import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientQueryKey } from './get-ingredient';
import type { UsedInEntry } from './types';

/** Every recipe and product using the ingredient at any depth. */
export async function getIngredientUsedIn(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<UsedInEntry[]> {
  return apiClient.get<UsedInEntry[]>(`/ingredients/${encodeURIComponent(code)}/used-in`, { signal });
}

export function getIngredientUsedInQueryOptions(code: string) {
  return queryOptions({
    queryKey: [...ingredientQueryKey(code), 'used-in'] as const,
    queryFn: ({ signal }) => getIngredientUsedIn(code, { signal }),
  });
}

export function useIngredientUsedIn(code: string) {
  return useQuery(getIngredientUsedInQueryOptions(code));
}
