import type { BookIngredient, IngredientView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export interface UpdateIngredientInput {
  code: string;
  ingredient: BookIngredient;
}

/** Saves the whole ingredient as a new revision. */
export async function updateIngredient({ code, ingredient }: UpdateIngredientInput): Promise<IngredientView> {
  return apiClient.put<IngredientView>(`/ingredients/${encodeURIComponent(code)}`, ingredient);
}

export function updateIngredientMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.updateIngredient(), mutationFn: updateIngredient });
}

/** Every declaration above the ingredient, where it is used and its history change with it. */
export function useUpdateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateIngredientMutationOptions(),
    onSettled: (saved, error, { code }) =>
      refreshAfterKitchenWrite(queryClient, {
        error,
        saved: saved ? [{ queryKey: queryKeys.ingredients.one(saved.id), data: saved }] : [],
        editing: [queryKeys.ingredients.one(code)],
      }),
  });
}
