import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { IngredientView } from './types';

/** Every ingredient (manager and pastry chef only): the line picker's choices. The API's array as sent. */
export async function getIngredients({ signal }: { signal?: AbortSignal } = {}): Promise<IngredientView[]> {
  return apiClient.get<IngredientView[]>('/ingredients', { signal });
}

export const ingredientsQueryKey = ['ingredients'] as const;

export function getIngredientsQueryOptions() {
  return queryOptions({ queryKey: ingredientsQueryKey, queryFn: ({ signal }) => getIngredients({ signal }) });
}

export function useIngredients({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getIngredientsQueryOptions(), enabled });
}
