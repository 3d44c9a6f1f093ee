import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { RecipeView } from '@crumbproof/shared';

/** Every recipe and product (all roles): the list, the swap check and the editor's picker read it. */
export async function getRecipes({ signal }: { signal?: AbortSignal } = {}): Promise<RecipeView[]> {
  return apiClient.get<RecipeView[]>('/recipes', { signal });
}

export const recipesQueryKey = ['recipes'] as const;

export function getRecipesQueryOptions() {
  return queryOptions({ queryKey: recipesQueryKey, queryFn: ({ signal }) => getRecipes({ signal }) });
}

export function useRecipes() {
  return useQuery(getRecipesQueryOptions());
}
