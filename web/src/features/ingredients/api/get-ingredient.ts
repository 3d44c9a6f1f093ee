import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientsQueryKey, type IngredientView } from './types';

export async function getIngredient(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<IngredientView> {
  return apiClient.get<IngredientView>(`/ingredients/${encodeURIComponent(code)}`, { signal });
}

export const ingredientQueryKey = (code: string) => [...ingredientsQueryKey, code] as const;

export function getIngredientQueryOptions(code: string) {
  return queryOptions({
    queryKey: ingredientQueryKey(code),
    queryFn: ({ signal }) => getIngredient(code, { signal }),
  });
}

export function useIngredient(code: string | undefined) {
  return useQuery({ ...getIngredientQueryOptions(code ?? ''), enabled: code !== undefined });
}
