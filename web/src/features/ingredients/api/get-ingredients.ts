import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientsQueryKey, type IngredientView } from './types';

/** The whole library in one answer: the API does not page it yet. */
export async function getIngredients({ signal }: { signal?: AbortSignal } = {}): Promise<IngredientView[]> {
  return apiClient.get<IngredientView[]>('/ingredients', { signal });
}

export function getIngredientsQueryOptions() {
  return queryOptions({
    queryKey: ingredientsQueryKey,
    queryFn: ({ signal }) => getIngredients({ signal }),
  });
}

export function useIngredients() {
  return useQuery(getIngredientsQueryOptions());
}
