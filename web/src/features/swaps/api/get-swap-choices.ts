import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import type { IngredientView, RecipeView } from './types';

/**
 * The swap check picks from every recipe and ingredient. These read the same endpoints under the
 * same keys and in the same shape (the API's array as sent) as the recipe and ingredient pages,
 * so the cache holds one copy and an applied swap refreshes them all.
 */
export const recipesQueryKey = ['recipes'] as const;
export const ingredientsQueryKey = ['ingredients'] as const;

export async function getRecipes({ signal }: { signal?: AbortSignal } = {}) {
  return apiClient.get<RecipeView[]>('/recipes', { signal });
}

export async function getIngredients({ signal }: { signal?: AbortSignal } = {}) {
  return apiClient.get<IngredientView[]>('/ingredients', { signal });
}

export function getRecipesQueryOptions() {
  return queryOptions({ queryKey: recipesQueryKey, queryFn: ({ signal }) => getRecipes({ signal }) });
}

export function getIngredientsQueryOptions() {
  return queryOptions({ queryKey: ingredientsQueryKey, queryFn: ({ signal }) => getIngredients({ signal }) });
}

export function useSwapChoices() {
  const recipes = useQuery(getRecipesQueryOptions());
  const ingredients = useQuery(getIngredientsQueryOptions());
  return { recipes, ingredients };
}
