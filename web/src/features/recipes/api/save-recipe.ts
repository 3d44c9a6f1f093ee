import type { BookRecipe, RecipeView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

/**
 * A new recipe (no code, POST), or an edit: the id it is saved under and the revision the editor
 * was loaded from, which the API refuses (stale-base) when someone saved a later one.
 */
export type SaveRecipeInput = { recipe: BookRecipe; code?: undefined } | { recipe: BookRecipe; code: string; baseRevision: number };

/** PUT /recipes/:code for an edit, POST /recipes for a new one. Nothing is saved if the API refuses. */
export async function saveRecipe(input: SaveRecipeInput): Promise<RecipeView> {
  if (input.code === undefined) return apiClient.post<RecipeView>('/recipes', input.recipe);
  return apiClient.put<RecipeView>(`/recipes/${encodeURIComponent(input.code)}`, { ...input.recipe, baseRevision: input.baseRevision });
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
