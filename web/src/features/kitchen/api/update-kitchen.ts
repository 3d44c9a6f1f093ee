import { kitchenSchema, type KitchenUpdate, type KitchenView } from '@crumbproof/shared';
import { mutationOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '@/lib/api-client';

export async function updateKitchen(changes: KitchenUpdate): Promise<KitchenView> {
  return kitchenSchema.parse(await apiClient.patch<unknown>('/kitchen', changes));
}

export function updateKitchenMutationOptions() {
  return mutationOptions({ mutationKey: ['kitchen', 'update'], mutationFn: updateKitchen });
}

/** Every declaration depends on the kitchen's regime and handling, so everything cached is read again. */
export function useUpdateKitchen() {
  const queryClient = useQueryClient();
  return useMutation({
    ...updateKitchenMutationOptions(),
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
