import type { BookIngredient } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';
import { ingredientsQueryKey, type IngredientView } from './types';

export async function createIngredient(input: BookIngredient): Promise<IngredientView> {
  return apiClient.post<IngredientView>('/ingredients', input);
}

export function createIngredientMutationOptions() {
  return mutationOptions({ mutationKey: ['ingredients', 'create'], mutationFn: createIngredient });
}

export function useCreateIngredient() {
  const queryClient = useQueryClient();
  return useMutation({
    ...createIngredientMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ingredientsQueryKey }),
  });
}
