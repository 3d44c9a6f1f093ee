import type { BookIngredient } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientsQueryKey, type IngredientView } from './types';

export interface UpdateIngredientInput {
  code: string;
  ingredient: BookIngredient;
}

/** Saves the whole ingredient as a new revision. */
export async function updateIngredient({ code, ingredient }: UpdateIngredientInput): Promise<IngredientView> {
  return apiClient.put<IngredientView>(`/ingredients/${encodeURIComponent(code)}`, ingredient);
}

export function updateIngredientMutationOptions() {
  return mutationOptions({ mutationKey: ['ingredients', 'update'], mutationFn: updateIngredient });
}

export function useUpdateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateIngredientMutationOptions(),
    // The list, this ingredient, its revisions and where it is used all change.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ingredientsQueryKey }),
  });
}
