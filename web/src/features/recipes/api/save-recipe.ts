import type { BookRecipe, RecipeView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export interface SaveRecipeInput {
  recipe: BookRecipe;
  /** The id the recipe is saved under; absent for a new recipe (POST). */
  code?: string;
}

/** PUT /recipes/:code for an edit, POST /recipes for a new one. Nothing is saved if the API refuses. */
export async function saveRecipe({ recipe, code }: SaveRecipeInput): Promise<RecipeView> {
  if (code === undefined) return apiClient.post<RecipeView>('/recipes', recipe);
  return apiClient.put<RecipeView>(`/recipes/${encodeURIComponent(code)}`, recipe);
}

export function saveRecipeMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.saveRecipe(), mutationFn: saveRecipe });
}

/** A recipe's change reaches every product above it: every declaration is read again. */
export function useSaveRecipe() {
  const queryClient = useQueryClient();
  return useMutation({
    ...saveRecipeMutationOptions(),
    onSettled: (saved, error, { code }) =>
      refreshAfterKitchenWrite(queryClient, {
        error,
        saved: saved ? [{ queryKey: queryKeys.recipes.one(saved.id), data: saved }] : [],
        editing: code === undefined ? [] : [queryKeys.recipes.one(code)],
      }),
  });
}
