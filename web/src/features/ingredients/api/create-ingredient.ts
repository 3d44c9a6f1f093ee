import type { BookIngredient, IngredientView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { refreshAfterKitchenWrite } from '@/api/kitchen-writes';
import { mutationKeys, queryKeys } from '@/api/query-keys';
import { apiClient } from '@/lib/api-client';

export async function createIngredient(input: BookIngredient): Promise<IngredientView> {
  return apiClient.post<IngredientView>('/ingredients', input);
}

export function createIngredientMutationOptions() {
  return mutationOptions({ mutationKey: mutationKeys.createIngredient(), mutationFn: createIngredient });
}

export function useCreateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    ...createIngredientMutationOptions(),
    onSettled: (saved, error) =>
      refreshAfterKitchenWrite(queryClient, {
        error,
        saved: saved ? [{ queryKey: queryKeys.ingredients.one(saved.id), data: saved }] : [],
      }),
  });
}
