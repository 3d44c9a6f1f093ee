import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { RecipeView } from '@crumbproof/shared';
import { queryKeys } from './query-keys';

/** Every recipe and product (all roles): the list, the swap check and the editor's picker read it. */
export async function getRecipes({ signal }: { signal?: AbortSignal } = {}): Promise<RecipeView[]> {
  return apiClient.get<RecipeView[]>('/recipes', { signal });
}

export function getRecipesQueryOptions() {
  return queryOptions({ queryKey: queryKeys.recipes.list(), queryFn: ({ signal }) => getRecipes({ signal }) });
}

export function useRecipes() {
  return useQuery(getRecipesQueryOptions());
}
