import type { BookIngredient, IngredientView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export interface UpdateIngredientInput {
  code: string;
  ingredient: BookIngredient;
  /** The revision the form was loaded from: the API refuses the save (stale-base) if someone saved a later one. */
  baseRevision: number;
}

/** Saves the whole ingredient as a new revision on top of the one it was edited from. */
export async function updateIngredient({ code, ingredient, baseRevision }: UpdateIngredientInput): Promise<IngredientView> {
  return apiClient.put<IngredientView>(`/ingredients/${encodeURIComponent(code)}`, { ...ingredient, baseRevision });
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
