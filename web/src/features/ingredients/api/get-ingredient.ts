import type { IngredientView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getIngredient(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<IngredientView> {
  return apiClient.get<IngredientView>(`/ingredients/${encodeURIComponent(code)}`, { signal });
}

export function getIngredientQueryOptions(code: string) {
  return queryOptions({
    queryKey: queryKeys.ingredients.one(code),
    queryFn: ({ signal }) => getIngredient(code, { signal }),
  });
}

export function useIngredient(code: string | undefined) {
  return useQuery({ ...getIngredientQueryOptions(code ?? ''), enabled: code !== undefined });
}
