import type { BookRecipe } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { declarationsQueryPrefix } from './get-declarations';
import { declarationQueryPrefix } from './get-declaration';
import { recipeQueryKey } from './get-recipe';
import { recipesQueryKey } from '@/api/recipes';
import { revisionsQueryKey } from './get-revisions';
import type { RecipeView } from './types';

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
  return mutationOptions({ mutationKey: ['recipes', 'save'], mutationFn: saveRecipe });
}

export function useSaveRecipe() {
  const queryClient = useQueryClient();
  return useMutation({
    ...saveRecipeMutationOptions(),
    onSuccess: (saved) => {
      queryClient.setQueryData(recipeQueryKey(saved.id), saved);
      void Promise.all([
        queryClient.invalidateQueries({ queryKey: recipeQueryKey(saved.id), exact: true }),
        queryClient.invalidateQueries({ queryKey: declarationQueryPrefix(saved.id) }),
        queryClient.invalidateQueries({ queryKey: revisionsQueryKey(saved.id) }),
        queryClient.invalidateQueries({ queryKey: recipesQueryKey, exact: true }),
        // A sub-recipe's change reaches every product that uses it.
        queryClient.invalidateQueries({ queryKey: declarationsQueryPrefix }),
        queryClient.invalidateQueries({ queryKey: ['recipes'], predicate: (query) => query.queryKey[2] === 'declaration' }),
      ]);
    },
  });
}
