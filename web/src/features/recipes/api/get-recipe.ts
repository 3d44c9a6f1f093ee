import type { RecipeView } from '@crumbproof/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function getRecipe(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<RecipeView> {
  return apiClient.get<RecipeView>(`/recipes/${encodeURIComponent(code)}`, { signal });
}

export function getRecipeQueryOptions(code: string) {
  return queryOptions({ queryKey: queryKeys.recipes.one(code), queryFn: ({ signal }) => getRecipe(code, { signal }) });
}

export function useRecipe(code: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getRecipeQueryOptions(code), enabled });
}
