import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { RecipeView } from './types';

export async function getRecipe(code: string, { signal }: { signal?: AbortSignal } = {}): Promise<RecipeView> {
  return apiClient.get<RecipeView>(`/recipes/${encodeURIComponent(code)}`, { signal });
}

export const recipeQueryKey = (code: string) => ['recipes', code] as const;

export function getRecipeQueryOptions(code: string) {
  return queryOptions({ queryKey: recipeQueryKey(code), queryFn: ({ signal }) => getRecipe(code, { signal }) });
}

export function useRecipe(code: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...getRecipeQueryOptions(code), enabled });
}
